// Display formats shared by tables and summaries: one place, so a value looks the same everywhere.

const dash = '—'

function finite(value: number | null | undefined): value is number {
  return typeof value === 'number' && Number.isFinite(value)
}

/** Azimuth as three whole-degree digits and one decimal: 45 → "045.0°". */
export function formatAzimuth(value: number | null | undefined, digits = 1): string {
  if (!finite(value)) return dash
  const [whole, fraction] = value.toFixed(digits).split('.')
  return `${whole.padStart(3, '0')}${fraction ? `.${fraction}` : ''}°`
}

export function formatAngle(value: number | null | undefined, digits = 1): string {
  return finite(value) ? `${value.toFixed(digits)}°` : dash
}

/** East-positive angle with its side named: 4.2 → "4.20° E", -1.5 → "1.50° W". */
export function formatEastWest(value: number | null | undefined, digits = 2): string {
  if (!finite(value)) return dash
  if (value === 0) return `${(0).toFixed(digits)}°`
  return `${Math.abs(value).toFixed(digits)}° ${value > 0 ? 'E' : 'W'}`
}

export function formatMetres(value: number | null | undefined, digits = 1): string {
  return finite(value) ? `${value.toFixed(digits)} m` : dash
}

export function formatNumber(value: number | null | undefined, digits = 1): string {
  return finite(value) ? value.toFixed(digits) : dash
}

export const referenceLineLabels = { bottom: 'Bottom of hole', top: 'Top of hole' } as const
export const declinationModeLabels = { auto: 'From geomagnetic model', manual: 'Manual' } as const
export const netProjectionLabels = { 'equal-area': 'Equal-area', 'equal-angle': 'Equal-angle' }
export const azimuthReferenceLabels = { magnetic: 'Magnetic', true: 'True', grid: 'Grid' } as const
export const holeStatusLabels = {
  planned: 'Planned',
  drilling: 'Drilling',
  complete: 'Complete',
  abandoned: 'Abandoned',
} as const

/** One line for a failed call: the API's message, else a generic one. */
export function describeError(err: unknown, fallback = 'Something went wrong.'): string {
  if (err instanceof Error && err.message) {
    const details = (err as { details?: { path: string; message: string }[] }).details ?? []
    if (details.length === 0) return err.message
    return `${err.message} ${details.map((d) => `${d.path}: ${d.message}`).join('; ')}`
  }
  return fallback
}
