// Downdip orientation engine: the only public entry. Degrees at this boundary everywhere; planes as
// { dipDirection, dip }, lines as { trend, plunge } with plunge positive down.

export type {
  CoreAngles,
  CoreLineAngles,
  CoreOptions,
  CoreReference,
  Line,
  Offset,
  Plane,
  Vec3,
} from './types'
export { azimuthDifference, wrap360 } from './math'

export { isSteepHole } from './hole-frame'
export { coreToPlane, planeToCore } from './core'
export { coreToLine } from './core-line'
export { coreToPlaneBatch } from './core-batch'
export type { CoreBatchInput, CoreBatchResult, PlaneBatch } from './core-batch'
export { highSideFromNorth, imagePickToPlane } from './image-pick'
export type { ImagePick } from './image-pick'

export { desurvey, doglegs } from './survey'
export type { Dogleg, SurveyPoint, SurveyStation } from './survey'
export { holeAt, holeAtBatch, positionAt, prepareSurvey } from './survey-interpolate'
export type { PreparedSurvey } from './survey-interpolate'
export { magneticDeclination, toGridAzimuth, toTrueAzimuth } from './declination'
export type { DeclinationQuery } from './declination'

export {
  angleBetweenLines,
  angleBetweenPlanes,
  apparentDip,
  planeIntersection,
  planeOfPole,
  poleOf,
} from './planes'
export { project, unproject } from './projection'
export type { NetPoint, NetProjection } from './projection'
export { greatCircle, smallCircle } from './circles'

export { linesToXyz, orientationTensor, orientationTensorBatch } from './tensor'
export type { OrientationTensor } from './tensor'
export { fisherStats, fisherStatsBatch } from './fisher'
export type { FisherOptions, FisherStats } from './fisher'
export { densityGrid } from './density'
export type { DensityGrid, DensityOptions } from './density'
export { countingCapAngle, EXPONENTIAL_TRUNCATION } from './density-kernels'
export type { DensityMethod } from './density-kernels'
export { clusterSets } from './cluster'
export type { ClusterOptions, ClusterResult, ClusterSet } from './cluster'
export { mulberry32 } from './random'
export { suggestK } from './suggest-k'
export type { KSuggestion } from './suggest-k'
export { setMembership } from './membership'
export type { SetCone } from './membership'

export { inBlindZone, TERZAGHI_CAP, terzaghiWeight, terzaghiWeightOfAlpha } from './terzaghi'
export { rqdClass, rqdFromFrequency, runMetrics, runMetricsOf } from './rqd'
export type { CoreRun, LoggedRun, RqdClass, RunFlag, RunMetrics } from './rqd'
export { kinematicChecks } from './kinematic'
export type { KinematicResult, PairVerdict, PlaneVerdict, WedgePair } from './kinematic'
export type { KinematicSettings, Verdict, WedgeVerdict } from './kinematic-rules'

export { computeStructures, storedInputs, structureFlags } from './logged-structures'
export type {
  ComputeContext,
  StructureComputed,
  StructureFlag,
  StructureInputs,
  StoredStructure,
} from './logged-structures'
export { azimuthSdAt, uncertaintyColumnsOf } from './logged-uncertainty'
export type { UncertaintyRow } from './logged-uncertainty'
export { DEFAULT_ERROR_MODEL, surveyInstrumentOf } from './error-model'
export type { ErrorModel, SurveyInstrument } from './error-model'
export {
  combinedCone95,
  orientationUncertainty,
  setMeanSystematic95,
  uncertaintyColumns,
  uncertaintyReasonBits,
} from './uncertainty'
export type { UncertaintyColumns, UncertaintyReason, UncertaintyResult } from './uncertainty'
export { fitSinusoid, planeToImageSinusoid, referNorth, sinusoidDepthAt } from './sinusoid-fit'
export type { ImageFrame, Sinusoid, SinusoidFit, TracePoint } from './sinusoid-fit'
export { DEFAULT_MIN_SCORE, detectSinusoids } from './sinusoid-detect'
export type { DetectOptions, ImageRows, SinusoidCandidate } from './sinusoid-detect'
export { renderWallImage, renderWallRows } from './image-synth'
export type { PlantedTrace, SynthOptions } from './image-synth'

export { reconcileCoreImage } from './reconcile'
export { RECONCILE_DEFAULTS } from './reconcile-types'
export type {
  ReconcileCoreItem,
  ReconcileDepthTrend,
  ReconcileImageItem,
  ReconcileMatch,
  ReconcileOptions,
  ReconcileResult,
  ReconcileRun,
  ReconcileRunItem,
} from './reconcile-types'
