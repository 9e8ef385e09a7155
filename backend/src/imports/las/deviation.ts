import type { LasCurve, LasProblem } from './types'

/** Mnemonics service companies use for hole direction channels (common practice, not a standard list). */
const AZIMUTH_MNEMONICS = new Set(['AZI', 'AZIM', 'AZIMUTH', 'AZ', 'HAZI', 'HAZIM', 'DEVA', 'MAZI'])
const INCLINATION_MNEMONICS = new Set([
  'DEVI',
  'DEV',
  'INC',
  'INCL',
  'INCLINATION',
  'DEVIATION',
  'HDEV',
])
const DEGREE_UNITS = new Set(['DEG', 'DEGS', 'DEGR', 'DEGREE', 'DEGREES', '°'])

export interface DeviationChannels {
  azimuthCurve: string
  inclinationCurve: string
}

/**
 * Finds a hole-azimuth and a hole-inclination channel (in degrees) among the curves. Both are
 * needed: one without the other is reported as a warning, as is a candidate not in degrees.
 */
export function detectDeviation(
  curves: LasCurve[],
  problems: LasProblem[],
): DeviationChannels | null {
  const pick = (names: Set<string>, what: string) => {
    let found: LasCurve | undefined
    for (const c of curves.slice(1)) {
      if (!names.has(c.mnemonic.toUpperCase())) continue
      if (!DEGREE_UNITS.has(c.unit.toUpperCase())) {
        problems.push({
          line: c.line,
          message: `${c.mnemonic} looks like ${what} but its unit "${c.unit}" is not degrees.`,
        })
      } else found ??= c
    }
    return found
  }
  const azimuth = pick(AZIMUTH_MNEMONICS, 'hole azimuth')
  const inclination = pick(INCLINATION_MNEMONICS, 'hole inclination')
  if (azimuth && inclination)
    return { azimuthCurve: azimuth.mnemonic, inclinationCurve: inclination.mnemonic }
  const lone = azimuth ?? inclination
  if (lone)
    problems.push({
      line: lone.line,
      message: `${lone.mnemonic} found without its partner channel: no deviation survey.`,
    })
  return null
}

export interface DeviationStation {
  /** Metres along hole, the depth of the sample used. */
  depth: number
  /** Degrees clockwise from the north the tool used, 0–360. */
  azimuth: number
  /** Degrees from vertical, as the tool records it. */
  inclination: number
  /** Degrees below horizontal (90 − inclination), Downdip's convention. */
  plunge: number
}

/**
 * One station per `interval` metres: for each multiple of the interval inside the log, the
 * nearest sample (within half an interval) where both channels have values. No averaging, so
 * azimuths either side of north are never blended.
 */
export function stationsFromDeviation(
  depths: Float64Array,
  azimuth: Float64Array,
  inclination: Float64Array,
  interval: number,
): DeviationStation[] {
  const valid: number[] = []
  for (let i = 0; i < depths.length; i++) {
    if (Number.isFinite(azimuth[i]) && Number.isFinite(inclination[i])) valid.push(i)
  }
  if (valid.length === 0) return []
  if (depths[valid[0]] > depths[valid[valid.length - 1]]) valid.reverse()
  const stations: DeviationStation[] = []
  const top = depths[valid[0]]
  const bottom = depths[valid[valid.length - 1]]
  let j = 0
  let last = -1
  for (let k = Math.ceil(top / interval - 1e-9); k * interval <= bottom + 1e-9; k++) {
    const target = k * interval
    while (
      j + 1 < valid.length &&
      Math.abs(depths[valid[j + 1]] - target) <= Math.abs(depths[valid[j]] - target)
    )
      j++
    const i = valid[j]
    if (i === last || Math.abs(depths[i] - target) > interval / 2) continue
    last = i
    const az = azimuth[i] >= 0 && azimuth[i] < 360 ? azimuth[i] : ((azimuth[i] % 360) + 360) % 360
    stations.push({
      depth: depths[i],
      azimuth: az,
      inclination: inclination[i],
      plunge: 90 - inclination[i],
    })
  }
  return stations
}
