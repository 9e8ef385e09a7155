import { z } from 'zod'
import {
  alphaConventions,
  betaApexes,
  confidences,
  depthUnits,
  enteredSources,
  importFieldSpecs,
  importOptionSpecs,
  parseStructureType,
  persistenceClasses,
  referenceLines,
  roughnessClasses,
  inputsComplete,
  structureFields,
  structureStates,
  weatheringGrades,
  type StructureInputT,
} from '../../../../schema/index'
import type { FieldSpec } from '../csv-rows'

const asked = importOptionSpecs.structures
/** How the file's angles and depths are given; converted once, here, and recorded on the import. */
export const StructureImportOptions = z
  .object({
    mode: z.enum(enteredSources).default(asked.mode.initial),
    referenceLine: z.enum(referenceLines).optional(),
    alphaConvention: z.enum(alphaConventions).default(asked.alphaConvention.initial),
    betaApex: z.enum(betaApexes).default(asked.betaApex.initial),
    depthUnit: z.enum(depthUnits).default(asked.depthUnit.initial),
  })
  .strict()
export type StructureImportOptionsT = z.infer<typeof StructureImportOptions>

export const structureFieldSpecs: readonly FieldSpec[] = importFieldSpecs.structures

const lower = <T extends readonly string[]>(values: T) =>
  z.preprocess((v) => (typeof v === 'string' ? v.trim().toLowerCase() : v), z.enum(values))

/**
 * One CSV row (numbers already parsed) → a structure input, in the file's stated conventions. One
 * zod pass per row: the numeric rules are the API's own (`structureFields`), the enums accept any
 * case, and the same completeness rule (`inputsComplete`) runs on the converted row.
 */
export function structureRowSchema(
  options: StructureImportOptionsT,
  mapped?: ReadonlySet<string>,
): z.ZodType<StructureInputT> {
  const f = structureFields
  const shape = {
    depth: f.depth,
    type: z.string().transform((t, ctx) => {
      const type = parseStructureType(t)
      if (!type) ctx.addIssue({ code: 'custom', message: `"${t}" is not a structure type` })
      return type ?? 'joint'
    }),
    alpha: f.alpha,
    beta: f.beta,
    gamma: f.gamma,
    dip: f.dip,
    dipDirection: f.dipDirection,
    roughness: z
      .preprocess(
        (v) => (typeof v === 'string' ? v.trim().toUpperCase() : v),
        z.enum(roughnessClasses),
      )
      .optional(),
    jrc: f.jrc,
    apertureMm: f.apertureMm,
    infillType: f.infillType,
    infillThicknessMm: f.infillThicknessMm,
    persistence: lower(persistenceClasses).optional(),
    wallWeathering: lower(weatheringGrades).optional(),
    state: lower(structureStates).optional(),
    confidence: lower(confidences).optional(),
    comment: f.comment,
  }
  // Only the columns the file maps are checked: unmapped fields are absent on every row anyway,
  // and a narrower object keeps a 100,000-row file quick.
  const used = mapped
    ? Object.fromEntries(Object.entries(shape).filter(([k]) => mapped.has(k)))
    : shape
  return (z.object(used) as unknown as z.ZodObject<typeof shape>)
    .transform(({ dip, dipDirection, alpha, beta, depth, ...r }): StructureInputT => {
      const angles =
        options.mode === 'true'
          ? { dip, dipDirection }
          : {
              alpha:
                alpha !== undefined && options.alphaConvention === 'core-axis-to-pole'
                  ? 90 - alpha
                  : alpha,
              beta:
                beta !== undefined && options.betaApex === 'up-hole' ? (beta + 180) % 360 : beta,
            }
      return {
        ...r,
        ...angles,
        source: options.mode,
        depth: options.depthUnit === 'ft' ? depth * 0.3048 : depth,
        ...(options.referenceLine ? { referenceLine: options.referenceLine } : {}),
      }
    })
    .superRefine(inputsComplete)
}
