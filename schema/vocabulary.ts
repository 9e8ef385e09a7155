/**
 * The words Downdip stores and shows, with no dependencies, so the browser can share them with the
 * tables and the API schemas. Trade terms; ISRM (1978) suggested-method classes where they exist.
 */
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
