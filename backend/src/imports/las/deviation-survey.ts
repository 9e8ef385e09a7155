import { detectDeviation, stationsFromDeviation, type DeviationChannels } from './deviation'
import type { DeviationStation } from './deviation'
import { depthsInMetres } from './summary'
import type { LasFile } from './types'

export interface DeviationSurvey extends DeviationChannels {
  interval: number
  depthShift: number
  stations: DeviationStation[]
}

/** Survey stations every `interval` metres from a file's deviation channels, or null without them. */
export function deviationSurvey(
  file: LasFile,
  interval: number,
  depthShift: number,
): DeviationSurvey | null {
  const channels = detectDeviation(file.curves, [])
  if (!channels) return null
  const values = (m: string) =>
    file.curves.find((c) => c.mnemonic === m)?.values ?? new Float64Array()
  const stations = stationsFromDeviation(
    depthsInMetres(file, depthShift),
    values(channels.azimuthCurve),
    values(channels.inclinationCurve),
    interval,
  )
  return { ...channels, interval, depthShift, stations }
}
