/**
 * The words Downdip stores and shows, with no dependencies, so the browser can share them with the
 * tables and the API schemas. Trade terms; ISRM (1978) suggested-method classes where they exist.
 */
/** Project roles, lowest to highest; a global admin counts as lead in every project. */
export const projectRoles = ['viewer', 'logger', 'engineer', 'lead'] as const
export type ProjectRole = (typeof projectRoles)[number]
/** The role ladder: guards (403) and services (what a role may do) both read it. */
export const roleRank = (role: ProjectRole) => projectRoles.indexOf(role)
export const roleAtLeast = (role: ProjectRole, min: ProjectRole) => roleRank(role) >= roleRank(min)

/** Holes, their survey and the project's conventions. */
export const holeStatuses = ['planned', 'drilling', 'complete', 'abandoned'] as const
export type HoleStatus = (typeof holeStatuses)[number]
export const azimuthReferences = ['magnetic', 'true', 'grid'] as const
export type AzimuthReference = (typeof azimuthReferences)[number]
export const declinationModes = ['auto', 'manual'] as const
export type DeclinationMode = (typeof declinationModes)[number]
/** Grid convergence: computed from the CRS at each collar, or one value typed by hand. */
export const convergenceModes = ['auto', 'manual'] as const
export type ConvergenceMode = (typeof convergenceModes)[number]
/** The line beta is measured from, on the core's bottom or top. */
export const referenceLines = ['bottom', 'top'] as const
export type ReferenceLine = (typeof referenceLines)[number]
export const netProjections = ['equal-area', 'equal-angle'] as const
export type NetProjection = (typeof netProjections)[number]

export const structureTypes = [
  'joint',
  'bedding',
  'foliation',
  'fault',
  'vein',
  'shear',
  'contact',
  'cleavage',
  'broken-zone',
] as const
export type StructureType = (typeof structureTypes)[number]

/** Two-letter keyboard codes of our own for structure types; the API always uses the full words. */
export const structureTypeCodes: Record<string, StructureType> = {
  jt: 'joint',
  bd: 'bedding',
  fo: 'foliation',
  fa: 'fault',
  vn: 'vein',
  sh: 'shear',
  ct: 'contact',
  cv: 'cleavage',
  bz: 'broken-zone',
}

/** A type as typed or imported (word, code, any case, "broken zone") → the API word, or undefined. */
export function parseStructureType(text: string): StructureType | undefined {
  const t = text
    .trim()
    .toLowerCase()
    .replace(/[\s_]+/g, '-')
  if ((structureTypes as readonly string[]).includes(t)) return t as StructureType
  return structureTypeCodes[t]
}

export const structureSources = ['core', 'image', 'true'] as const
export type StructureSource = (typeof structureSources)[number]
/** Sources a logger posts or a structure file holds; image structures come from picks. */
export const enteredSources = ['core', 'true'] as const
export type EnteredSource = (typeof enteredSources)[number]
/** Reconciliation adjustments: the image side's depth shift, a core run's orientation-line rotation. */
export const adjustmentKinds = ['depth-shift', 'run-rotation'] as const
export type AdjustmentKind = (typeof adjustmentKinds)[number]

/** Reconciliation verdicts on a core run's orientation line. */
export const runVerdicts = ['ok', 'suspect', 'wrong'] as const
export type RunVerdict = (typeof runVerdicts)[number]

/** Why an orientation's uncertainty is large (uncertainty.ts). */
export const uncertaintyReasons = [
  'steep-hole', // bottom-of-hole mark poorly defined near vertical
  'alpha-near-90', // ellipse nearly a circle: beta barely defined
  'alpha-near-0', // plane near the core axis: small reading errors swing it
  'no-survey', // the planned direction stood in for a survey
] as const
export type UncertaintyReason = (typeof uncertaintyReasons)[number]

export const markConfidences = ['good', 'fair', 'poor', 'none'] as const
export type MarkConfidence = (typeof markConfidences)[number]

/** ISRM (1978) roughness profile classes I–IX. */
export const roughnessClasses = ['I', 'II', 'III', 'IV', 'V', 'VI', 'VII', 'VIII', 'IX'] as const
/** ISRM (1978) persistence classes; from core it cannot be measured: "not determined". */
export const persistenceClasses = [
  'not determined',
  'very low',
  'low',
  'medium',
  'high',
  'very high',
] as const
/** ISRM (1978) weathering grades of the wall rock. */
export const weatheringGrades = [
  'fresh',
  'slightly',
  'moderately',
  'highly',
  'completely',
  'residual soil',
] as const
export const structureStates = ['open', 'closed', 'healed'] as const
export type StructureState = (typeof structureStates)[number]
export const confidences = ['high', 'medium', 'low'] as const
export type Confidence = (typeof confidences)[number]

/** Review: an interval goes draft → checked → approved → issued. */
export const intervalStatuses = ['draft', 'checked', 'approved', 'issued'] as const
export type IntervalStatus = (typeof intervalStatuses)[number]
export const setRules = ['cone', 'cluster'] as const
export type SetRule = (typeof setRules)[number]
export const analysisWeightings = ['terzaghi', 'none'] as const
export type AnalysisWeighting = (typeof analysisWeightings)[number]
export const contourMethods = ['kamb', 'exponential'] as const
export type ContourMethod = (typeof contourMethods)[number]
export const commentEntities = ['structure', 'interval'] as const
export type CommentEntity = (typeof commentEntities)[number]

/** Files in and out: what an upload holds and where it stands; design packs; e-mail tokens. */
export const importKinds = ['survey', 'runs', 'structures', 'picks', 'las'] as const
export type ImportKind = (typeof importKinds)[number]
/** The import kinds read from CSV (LAS has its own reader). */
export const csvImportKinds = ['structures', 'runs', 'survey', 'picks'] as const
export type CsvImportKind = (typeof csvImportKinds)[number]
export const importStatuses = [
  'previewed',
  'queued',
  'committing',
  'committed',
  'failed',
  'undone',
] as const
export type ImportStatus = (typeof importStatuses)[number]
export const packStatuses = ['queued', 'building', 'ready', 'failed', 'issued'] as const
export type PackStatus = (typeof packStatuses)[number]
export const tokenPurposes = ['invite', 'reset'] as const

/**
 * Televiewer images: what an image shows (acoustic amplitude, acoustic travel time, optical true
 * colour), where it came from (a raster strip or a LAS image array), and where it stands (a large
 * upload is tiled by a background job).
 */
export const imageKinds = ['amplitude', 'traveltime', 'optical'] as const
export type ImageKind = (typeof imageKinds)[number]
export const imageSources = ['raster', 'las'] as const
export type ImageSource = (typeof imageSources)[number]
export const imageStatuses = ['processing', 'ready', 'failed'] as const
export type ImageStatus = (typeof imageStatuses)[number]
/** Image azimuth 0 (the left edge before the left-edge azimuth is added): north or the high side. */
export const imageAzimuthReferences = ['north', 'highside'] as const
export type ImageAzimuthReference = (typeof imageAzimuthReferences)[number]
/** Which north a north-referenced image is oriented to. */
export const imageNorthReferences = ['magnetic', 'true'] as const
export type ImageNorthReference = (typeof imageNorthReferences)[number]

/**
 * Set colours, one palette for the screen's nets and tables and the design pack's nets: Downdip's
 * own, mid-tone so they read on the light and the dark panel alike, distinct from the accent used
 * for contours. The n-th set of an interval (in the analysis order) takes setColour(n).
 */
export const setPalette = [
  '#d0602c', // kiln orange
  '#2f79b5', // slate blue
  '#8e58b3', // heather
  '#3a965b', // moss
  '#c23f78', // berry
  '#a8851a', // ochre
  '#3f9ea4', // tarn
  '#7b6f5a', // flint
] as const

/** Poles outside every set. */
export const unassignedSetColour = '#8a93a0'

/** The colour of the set at `index` (repeating past the palette); a negative index is no set. */
export function setColour(index: number): string {
  return index < 0 ? unassignedSetColour : setPalette[index % setPalette.length]
}

/** An interval's analysis settings: saved with it, frozen from approval on, used by its pack. */
export const analysisSettingKeys = [
  'weighting',
  'contourMethod',
  'faceDip',
  'faceDipDirection',
  'frictionDeg',
  'lateralLimitDeg',
  'topplingLimitDeg',
] as const
export type AnalysisSettingKey = (typeof analysisSettingKeys)[number]

export * from './vocabulary-imports'
