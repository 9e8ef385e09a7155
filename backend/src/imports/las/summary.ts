import { detectDeviation, type DeviationChannels } from './deviation'
import type { LasCurve, LasDataSet, LasFile, LasProblem, LasVersion } from './types'

/** Stored depths are rounded to the micrometre, so 10 ft reads 3.048 m and not 3.0480000000000005. */
const roundDepth = (m: number) => Math.round(m * 1e6) / 1e6

/** The index converted to metres along hole, with the depth shift added (stored = log + shift). */
export function depthsInMetres(file: LasFile, depthShift = 0): Float64Array {
  const index = file.curves[0].values
  const out = new Float64Array(index.length)
  for (let i = 0; i < index.length; i++)
    out[i] = roundDepth(index[i] * file.metresPerDepthUnit + depthShift)
  return out
}

export interface CurveSummary {
  mnemonic: string
  unit: string
  description: string
  nullCount: number
  min: number | null
  max: number | null
  /** A LAS 3.0 text column: shown and kept in the file, not stored as a curve. */
  text?: boolean
  /** Its first values, for the preview (text columns only). */
  sample?: string[]
}

export function curveSummary(curve: LasCurve): CurveSummary {
  if (curve.text) {
    const { mnemonic, unit, description } = curve
    const blank = curve.text.filter((t) => t.trim() === '').length
    return {
      mnemonic,
      unit,
      description,
      nullCount: blank,
      min: null,
      max: null,
      text: true,
      sample: curve.text.slice(0, 5),
    }
  }
  let nullCount = 0
  let min = Infinity
  let max = -Infinity
  for (const v of curve.values) {
    if (Number.isNaN(v)) nullCount++
    else {
      if (v < min) min = v
      if (v > max) max = v
    }
  }
  const none = nullCount === curve.values.length
  const { mnemonic, unit, description } = curve
  return { mnemonic, unit, description, nullCount, min: none ? null : min, max: none ? null : max }
}

const WELL_FIELDS = {
  name: 'WELL',
  company: 'COMP',
  field: 'FLD',
  location: 'LOC',
  serviceCompany: 'SRVC',
  date: 'DATE',
  uwi: 'UWI',
} as const

export interface LasSummary {
  version: LasVersion
  wrap: boolean
  well: Record<keyof typeof WELL_FIELDS, string | null> & {
    start: number | null
    stop: number | null
    step: number | null
    nullValue: number | null
    items: { mnemonic: string; unit: string; value: string; description: string }[]
  }
  depthUnit: string
  index: { mnemonic: string; unit: string; description: string }
  curves: CurveSummary[]
  /** Metres, before any depth shift. */
  depthRange: { from: number; to: number }
  /** Metres; null when irregular (STEP 0) or not given. */
  step: number | null
  sampleCount: number
  problems: LasProblem[]
  deviation: DeviationChannels | null
  /** LAS 3.0 data sets read besides the log. */
  dataSets: {
    name: string
    kind: LasDataSet['kind']
    line: number
    rows: number
    columns: string[]
  }[]
}

/**
 * The file whose curves carry the hole survey: the log itself when it has azimuth and inclination
 * channels, else a LAS 3.0 inclinometry set (its own depth index and unit), else null.
 */
export function surveySource(
  file: LasFile,
  problems: LasProblem[] = [],
): { file: LasFile; channels: DeviationChannels; set: string | null } | null {
  const own = detectDeviation(file.curves, problems)
  if (own) return { file, channels: own, set: null }
  for (const set of file.dataSets) {
    if (set.kind !== 'inclinometry' || set.metresPerDepthUnit === null) continue
    const channels = detectDeviation(set.curves, problems)
    if (channels)
      return {
        file: {
          ...file,
          curves: set.curves,
          metresPerDepthUnit: set.metresPerDepthUnit,
          depthUnit: set.depthUnit,
          sampleCount: set.sampleCount,
        },
        channels,
        set: set.name,
      }
  }
  return null
}

/** What the preview shows about a file that was read. */
export function lasSummary(file: LasFile): LasSummary {
  const problems = [...file.problems]
  const deviation = surveySource(file, problems)?.channels ?? null
  const depths = depthsInMetres(file)
  const first = depths[0]
  const last = depths[depths.length - 1]
  const well = Object.fromEntries(
    Object.entries(WELL_FIELDS).map(([key, m]) => [key, file.well[m]?.value || null]),
  ) as Record<keyof typeof WELL_FIELDS, string | null>
  const [index, ...curves] = file.curves
  return {
    version: file.version,
    wrap: file.wrap,
    well: {
      ...well,
      start: file.start,
      stop: file.stop,
      step: file.step,
      nullValue: file.nullValue,
      items: Object.values(file.well).map(({ mnemonic, unit, value, description }) => ({
        mnemonic,
        unit,
        value,
        description,
      })),
    },
    depthUnit: file.depthUnit,
    index: { mnemonic: index.mnemonic, unit: index.unit, description: index.description },
    curves: curves.map(curveSummary),
    depthRange: { from: Math.min(first, last), to: Math.max(first, last) },
    step: file.step ? roundDepth(Math.abs(file.step) * file.metresPerDepthUnit) : null,
    sampleCount: file.sampleCount,
    problems,
    deviation,
    dataSets: file.dataSets.map((d) => ({
      name: d.name,
      kind: d.kind,
      line: d.line,
      rows: d.sampleCount,
      columns: d.curves.map((c) => c.mnemonic),
    })),
  }
}
