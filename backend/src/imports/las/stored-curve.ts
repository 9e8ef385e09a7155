import { depthsInMetres } from './summary'
import type { LasFile } from './types'

/** One curve as stored: parallel arrays, leading and trailing absent samples dropped. */
export interface StoredSamples {
  depths: number[]
  values: (number | null)[]
  minDepth: number
  maxDepth: number
}

/**
 * Depths (metres, after shift) and values (NaN = absent) → the arrays of a `log_curves` row,
 * sorted by increasing depth. Absent samples inside the curve stay as null; a curve with no value
 * at all gives null (nothing worth storing).
 */
export function storedSamples(depths: Float64Array, values: Float64Array): StoredSamples | null {
  let a = 0
  let b = values.length - 1
  while (a <= b && Number.isNaN(values[a])) a++
  while (b >= a && Number.isNaN(values[b])) b--
  if (a > b) return null
  const n = b - a + 1
  const descending = depths[b] < depths[a]
  const outDepths = new Array<number>(n)
  const outValues = new Array<number | null>(n)
  for (let k = 0; k < n; k++) {
    const i = descending ? b - k : a + k
    outDepths[k] = depths[i]
    outValues[k] = Number.isNaN(values[i]) ? null : values[i]
  }
  return {
    depths: outDepths,
    values: outValues,
    minDepth: outDepths[0],
    maxDepth: outDepths[n - 1],
  }
}

/**
 * PostgreSQL array text for float8[] with NULL elements, e.g. `{1.5,NULL,2}`; sent as one bound
 * parameter and cast in SQL (`$1::float8[]`).
 */
export function float8ArrayLiteral(values: readonly (number | null)[]): string {
  const parts = new Array<string>(values.length)
  for (let i = 0; i < values.length; i++) {
    const v = values[i]
    parts[i] = v === null || !Number.isFinite(v) ? 'NULL' : String(v)
  }
  return `{${parts.join(',')}}`
}

export interface CurveToStore extends StoredSamples {
  mnemonic: string
  unit: string
  description: string
  /** float8[] text of `depths` and `values`, ready to bind (see float8ArrayLiteral). */
  depthsLiteral: string
  valuesLiteral: string
}

/** Stored log depths (metres, after the shift) must lie in this range: a hole, not a typo. */
export const STORED_DEPTH_RANGE = { min: -100, max: 15_000 } as const

export interface CurveChoice {
  /** Set when the shifted depths leave STORED_DEPTH_RANGE: nothing may be stored. */
  outOfRange?: { min: number; max: number }
  curves: CurveToStore[]
  /** Chosen curves with no value at all: not stored. */
  skipped: string[]
  /** Requested names that are not data curves of the file, by their position in the request. */
  unknown: { position: number; message: string }[]
}

/** The data curves to store from a file: all but the index when `wanted` is undefined. */
export function curvesToStore(
  file: LasFile,
  wanted: string[] | undefined,
  depthShift: number,
): CurveChoice {
  const [index, ...all] = file.curves
  // text columns (LAS 3.0 {S}) stay in the kept file and the preview; only numbers are curves
  const available = all.filter((c) => !c.text)
  const names = wanted ?? available.map((c) => c.mnemonic)
  const unknown = names.flatMap((m, position) =>
    available.some((c) => c.mnemonic === m)
      ? []
      : [
          {
            position,
            message:
              m === index.mnemonic
                ? 'That is the depth index.'
                : all.some((c) => c.mnemonic === m)
                  ? 'A text column: kept in the file, not stored as a curve.'
                  : 'No such curve in the file.',
          },
        ],
  )
  const depths = depthsInMetres(file, depthShift)
  let lo = Infinity
  let hi = -Infinity
  for (const d of depths) {
    if (d < lo) lo = d
    if (d > hi) hi = d
  }
  if (depths.length && (lo < STORED_DEPTH_RANGE.min || hi > STORED_DEPTH_RANGE.max))
    return { outOfRange: { min: lo, max: hi }, curves: [], skipped: [], unknown }
  const curves: CurveToStore[] = []
  const skipped: string[] = []
  // most curves span the same samples: write their shared depth array once
  const depthText = new Map<string, string>()
  for (const c of available) {
    if (!names.includes(c.mnemonic)) continue
    const samples = storedSamples(depths, c.values)
    if (!samples) {
      skipped.push(c.mnemonic)
      continue
    }
    const key = `${samples.minDepth}:${samples.maxDepth}:${samples.depths.length}`
    if (!depthText.has(key)) depthText.set(key, float8ArrayLiteral(samples.depths))
    curves.push({
      ...samples,
      mnemonic: c.mnemonic,
      unit: c.unit,
      description: c.description,
      depthsLiteral: depthText.get(key)!,
      valuesLiteral: float8ArrayLiteral(samples.values),
    })
  }
  return { curves, skipped, unknown }
}
