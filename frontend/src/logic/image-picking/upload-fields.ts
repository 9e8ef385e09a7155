// The upload form of the Images tab: what was typed → the request, and the server's refusals back
// onto the fields that caused them.
import type {
  ImageAzimuthReference,
  ImageKind,
  ImageNorthReference,
} from '../../../../schema/vocabulary'
import type { ErrorDetail } from '../../api/types'
import type { ImageUpload } from '../../api/images'

export const uploadFieldNames = [
  'file',
  'topDepth',
  'bottomDepth',
  'leftAzimuth',
  'azimuthReference',
  'northReference',
  'kind',
  'diameterMm',
] as const
export type UploadField = (typeof uploadFieldNames)[number]
export type UploadErrors = Partial<Record<UploadField | 'form', string>>

export interface UploadDraft {
  file: File | null
  topDepth: number | null
  bottomDepth: number | null
  leftAzimuth: number | null
  azimuthReference: ImageAzimuthReference
  northReference: ImageNorthReference
  /** Empty: the server decides (LAS arrays are named by their curves; rasters amplitude). */
  kind: ImageKind | ''
  diameterMm: number | null
}

export const emptyUpload = (): UploadDraft => ({
  file: null,
  topDepth: null,
  bottomDepth: null,
  leftAzimuth: null,
  azimuthReference: 'north',
  northReference: 'magnetic',
  kind: '',
  diameterMm: null,
})

/** A LAS file (its depths and arrays come from the file) rather than a raster picture. */
export const isLasFile = (file: File | null) => !!file && /\.las$/i.test(file.name)

/**
 * Nominal hole diameter (mm) for a wireline core size, shown as the diameter's placeholder:
 * NQ ≈ 75.7, HQ ≈ 96, PQ ≈ 122.6 (common practice, from memory); the server uses the same table.
 */
export function nominalDiameterMm(coreSize: string): number | undefined {
  const size = coreSize
    .trim()
    .toUpperCase()
    .replace(/[0-9]+$/, '')
  return ({ NQ: 75.7, HQ: 96, PQ: 122.6 } as Record<string, number>)[size]
}

/** What the browser can tell before sending; the server checks everything again. */
export function checkUpload(d: UploadDraft): UploadErrors {
  const errors: UploadErrors = {}
  if (!d.file) errors.file = 'Choose a file.'
  if (d.file && !isLasFile(d.file)) {
    if (d.topDepth === null) errors.topDepth = 'A picture needs the depth of its top row.'
    if (d.bottomDepth === null) errors.bottomDepth = 'A picture needs the depth of its bottom row.'
    if (d.topDepth !== null && d.bottomDepth !== null && d.bottomDepth <= d.topDepth)
      errors.bottomDepth = 'Must be deeper than the top.'
  }
  return errors
}

export function toUpload(d: UploadDraft, confirmDuplicate = false): ImageUpload {
  const las = isLasFile(d.file)
  const given = (v: number | null) => (v === null ? undefined : v)
  return {
    file: d.file!,
    topDepth: las ? undefined : given(d.topDepth),
    bottomDepth: las ? undefined : given(d.bottomDepth),
    leftAzimuth: given(d.leftAzimuth),
    azimuthReference: d.azimuthReference,
    northReference: d.azimuthReference === 'north' ? d.northReference : undefined,
    kind: d.kind === '' ? undefined : d.kind,
    diameterMm: given(d.diameterMm),
    confirmDuplicate: confirmDuplicate || undefined,
  }
}

/**
 * The server's details (`body.topDepth`, `topDepth`, `file…`) on the field they name; what names
 * no field goes under the form.
 */
export function uploadErrors(details: readonly ErrorDetail[], message: string): UploadErrors {
  const out: UploadErrors = {}
  for (const d of details) {
    const name = d.path.replace(/^(body|fields)\./, '').split('.')[0] as UploadField
    const field: UploadField | 'form' = uploadFieldNames.includes(name) ? name : 'form'
    const text = field === 'form' && d.path ? `${d.path}: ${d.message}` : d.message
    out[field] = out[field] ? `${out[field]} ${text}` : text
  }
  if (Object.keys(out).length === 0) out.file = message
  return out
}
