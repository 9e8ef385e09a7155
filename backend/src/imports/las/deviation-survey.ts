import { stationsFromDeviation, type DeviationChannels } from './deviation'
import type { DeviationStation } from './deviation'
import { depthsInMetres, surveySource } from './summary'
import type { LasFile } from './types'

export interface DeviationSurvey extends DeviationChannels {
  interval: number
  depthShift: number
  stations: DeviationStation[]
}

/**
 * Survey stations every `interval` metres from a file's deviation channels — the log's own, or a
 * LAS 3.0 inclinometry set's — or null without them.
 */
export function deviationSurvey(
  file: LasFile,
  interval: number,
  depthShift: number,
): DeviationSurvey | null {
  const source = surveySource(file)
  if (!source) return null
  const { channels } = source
  const values = (m: string) =>
    source.file.curves.find((c) => c.mnemonic === m)?.values ?? new Float64Array()
  const stations = stationsFromDeviation(
    depthsInMetres(source.file, depthShift),
    values(channels.azimuthCurve),
    values(channels.inclinationCurve),
    interval,
  )
  return { ...channels, interval, depthShift, stations }
}
