/** Request schemas for core runs and structures, shared by the API, CSV imports and the entry grid. */
import { z } from 'zod'
import {
  confidences,
  enteredSources,
  markConfidences,
  persistenceClasses,
  referenceLines,
  roughnessClasses,
  structureStates,
  structureTypes,
  weatheringGrades,
  type EnteredSource,
} from './vocabulary'

const depth = z.number().min(0).max(5000)
const version = z.number().int().positive()

export const RunFields = z
  .object({
    fromDepth: depth,
    toDepth: depth,
    recovered: z.number().min(0).max(100),
    solid: z.number().min(0).max(100),
    rqdLength: z.number().min(0).max(100),
    fractureCount: z.number().int().min(0).max(10000),
    markConfidence: z.enum(markConfidences),
    comment: z.string().max(500),
  })
  .strict()

/** A run as entered: limits in order, lengths within the run and each other. */
export const RunInput = RunFields.extend({
  fractureCount: RunFields.shape.fractureCount.default(0),
  markConfidence: RunFields.shape.markConfidence.default('good'),
  comment: RunFields.shape.comment.default(''),
})
  .refine((r) => r.toDepth > r.fromDepth, {
    path: ['toDepth'],
    message: 'must be greater than fromDepth',
  })
  .refine((r) => r.recovered <= r.toDepth - r.fromDepth + 1e-9, {
    path: ['recovered'],
    message: 'recovered length is longer than the run',
  })
  .refine((r) => r.solid <= r.recovered + 1e-9, {
    path: ['solid'],
    message: 'solid core is longer than recovered',
  })
  .refine((r) => r.rqdLength <= r.recovered + 1e-9, {
    path: ['rqdLength'],
    message: 'RQD length is longer than recovered',
  })

export const RunUpdateBody = RunFields.partial().extend({ version }).strict()
export const RunsReplaceBody = z.object({ runs: z.array(RunInput).max(5000) }).strict()

/** The field rules of a structure, shared by the API body and the CSV import rows. */
export const structureFields = {
  depth,
  type: z.enum(structureTypes),
  source: z.enum(enteredSources),
  alpha: z.number().min(0).max(90).optional(),
  beta: z.number().min(0).max(360).optional(),
  gamma: z.number().min(0).max(360).optional(),
  dip: z.number().min(0).max(90).optional(),
  dipDirection: z.number().min(0).max(360).optional(),
  referenceLine: z.enum(referenceLines).optional(),
  roughness: z.enum(roughnessClasses).optional(),
  jrc: z.number().min(0).max(20).optional(),
  apertureMm: z.number().min(0).max(10000).optional(),
  infillType: z.string().trim().max(60).optional(),
  infillThicknessMm: z.number().min(0).max(10000).optional(),
  persistence: z.enum(persistenceClasses).optional(),
  wallWeathering: z.enum(weatheringGrades).optional(),
  state: z.enum(structureStates).optional(),
  confidence: z.enum(confidences).optional(),
  comment: z.string().max(1000).optional(),
}

type StructureShape = {
  source?: EnteredSource
  alpha?: number
  dip?: number
  dipDirection?: number
}
/** Core measurements need alpha; true orientations need dip and dip direction. */
export const inputsComplete = (s: StructureShape, ctx: z.RefinementCtx) => {
  if ((s.source ?? 'core') === 'core' && s.alpha === undefined) {
    ctx.addIssue({
      code: 'custom',
      path: ['alpha'],
      message: 'alpha is required for a core measurement',
    })
  }
  if (s.source === 'true') {
    if (s.dip === undefined)
      ctx.addIssue({
        code: 'custom',
        path: ['dip'],
        message: 'dip is required for a true orientation',
      })
    if (s.dipDirection === undefined) {
      ctx.addIssue({
        code: 'custom',
        path: ['dipDirection'],
        message: 'dip direction is required for a true orientation',
      })
    }
  }
}

/** A structure as posted: core angles (beta may be absent on unoriented core) or a true orientation. */
export const StructureInput = z
  .object({ ...structureFields, source: structureFields.source.default('core') })
  .strict()
  .superRefine(inputsComplete)
/**
 * Fields a logger may clear on an edit (null): beta (unoriented core), gamma and the attributes;
 * depth, type, source, alpha and a true orientation cannot be blanked.
 */
const clearable = [
  'beta',
  'gamma',
  'referenceLine',
  'roughness',
  'jrc',
  'apertureMm',
  'infillType',
  'infillThicknessMm',
  'persistence',
  'wallWeathering',
  'state',
  'confidence',
] as const
export const StructureUpdateBody = z
  .object({
    ...structureFields,
    ...Object.fromEntries(
      clearable.map((k) => [k, structureFields[k].unwrap().nullable().optional()]),
    ),
  } as typeof structureFields)
  .partial()
  .extend({ version })
  .strict()

export type RunInputT = z.infer<typeof RunInput>
export type RunUpdate = z.infer<typeof RunUpdateBody>
export type StructureInputT = z.infer<typeof StructureInput>
/** A structure as a client sends it: source may be left out (core). */
export type StructureSent = z.input<typeof StructureInput>
export type StructureUpdate = z.infer<typeof StructureUpdateBody>
