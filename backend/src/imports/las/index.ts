/** The LAS reader: CWLS LAS 2.0 and 3.0 log files → typed curves, summaries and stored rows. */
export { readLas } from './read-las'
export { LasReadError } from './types'
export type { HeaderItem, LasCurve, LasDataSet, LasFile, LasProblem, LasSectionNote } from './types'
export {
  depthsInMetres,
  lasSummary,
  surveySource,
  type CurveSummary,
  type LasSummary,
} from './summary'
export {
  detectDeviation,
  stationsFromDeviation,
  type DeviationChannels,
  type DeviationStation,
} from './deviation'
export {
  curvesToStore,
  float8ArrayLiteral,
  storedSamples,
  STORED_DEPTH_RANGE,
  type CurveToStore,
} from './stored-curve'
export { deviationSurvey, type DeviationSurvey } from './deviation-survey'
export { decodeLasText } from './text'
export { headerNumber } from './header-line'
