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
export const confidences = ['high', 'medium', 'low'] as const

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
