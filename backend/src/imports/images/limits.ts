import { ApiError, type ErrorDetail } from '../../http/errors'

/**
 * What an image may be, checked from its header before a pixel is decoded. Our caps: a turn of
 * 4096 samples is finer than any televiewer records (common practice: 72–1800 per turn); 400,000
 * rows is 800 m at 2 mm; 64 M samples (64 MB of 8-bit grey) bounds the memory one decode takes.
 */
export const IMAGE_LIMITS = {
  /** Fewer samples a turn than a LAS array needs members: no sinusoid can be seen on it. */
  minWidth: 8,
  maxWidth: 4096,
  maxHeight: 400_000,
  maxPixels: 64 * 1024 * 1024,
  minRowStepMm: 0.2,
  maxRowStepMm: 50,
} as const

/** Images over this many samples (width × height × channels) are tiled by the background job. */
export const INLINE_SAMPLES = 4_000_000
export const TILE_ROWS = 256

/** A file refused for what it holds: 422 (or 413 when it is too large), naming the part. */
export const refuseFile = (
  code: string,
  message: string,
  details: ErrorDetail[] = [{ path: 'file', message }],
  status = 422,
) => new ApiError(status, code, message, details)

/** Refuses a width or height past the caps (413) or too narrow to be an image of a turn (422). */
export function checkDimensions(width: number, height: number, what = 'The image'): void {
  const { minWidth, maxWidth, maxHeight, maxPixels } = IMAGE_LIMITS
  const size = `${width} × ${height}`
  if (!(width >= 1 && height >= 1))
    throw refuseFile('invalid_file', `${what} declares no pixels (${size}).`)
  if (width > maxWidth)
    throw tooLarge(`${what} is ${width} samples across: at most ${maxWidth} a turn are read.`)
  if (height > maxHeight)
    throw tooLarge(`${what} is ${height} rows long: at most ${maxHeight} rows are read.`)
  if (width * height > maxPixels)
    throw tooLarge(`${what} is ${size} = ${width * height} samples: at most ${maxPixels} are read.`)
  if (width < minWidth)
    throw refuseFile(
      'invalid_file',
      `${what} is ${width} samples across: a turn needs at least ${minWidth}.`,
    )
}

const tooLarge = (message: string) =>
  refuseFile('image_too_large', message, [{ path: 'file', message }], 413)

/** Millimetres per row, or a refusal naming `path` when it is outside 0.2–50 mm. */
export function checkRowStep(
  rows: number,
  topDepth: number,
  bottomDepth: number,
  path: string,
  status = 400,
): number {
  const stepMm = ((bottomDepth - topDepth) * 1000) / rows
  const { minRowStepMm, maxRowStepMm } = IMAGE_LIMITS
  if (stepMm >= minRowStepMm - 1e-9 && stepMm <= maxRowStepMm + 1e-9) return stepMm
  const span = +(bottomDepth - topDepth).toFixed(4)
  const message = `${rows} rows over ${span} m is ${+stepMm.toPrecision(3)} mm per row: between ${minRowStepMm} and ${maxRowStepMm} mm expected. Check the depths.`
  const code = status === 400 ? 'invalid_input' : 'invalid_depths'
  throw new ApiError(status, code, message, [{ path, message }])
}
