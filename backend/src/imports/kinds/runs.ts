import { z } from 'zod'
import {
  depthUnits,
  importFieldSpecs,
  importOptionSpecs,
  markConfidences,
  RunInput,
  type RunInputT,
} from '../../../../schema/index'
import type { FieldSpec } from '../csv-rows'
import { validateWith } from './pipe'

export const RunImportOptions = z
  .object({ depthUnit: z.enum(depthUnits).default(importOptionSpecs.runs.depthUnit.initial) })
  .strict()
export type RunImportOptionsT = z.infer<typeof RunImportOptions>

export const runFieldSpecs: readonly FieldSpec[] = importFieldSpecs.runs

/** One CSV row → a run, lengths converted from feet where the file says so. */
export function runRowSchema(options: RunImportOptionsT): z.ZodType<RunInputT> {
  const k = options.depthUnit === 'ft' ? 0.3048 : 1
  return z
    .object({
      fromDepth: z.number(),
      toDepth: z.number(),
      recovered: z.number(),
      solid: z.number(),
      rqdLength: z.number(),
      fractureCount: z.number().optional(),
      markConfidence: z
        .preprocess(
          (v) => (typeof v === 'string' ? v.trim().toLowerCase() : v),
          z.enum(markConfidences),
        )
        .optional(),
      comment: z.string().optional(),
    })
    .transform((r, ctx) =>
      validateWith(
        RunInput,
        {
          ...r,
          fromDepth: r.fromDepth * k,
          toDepth: r.toDepth * k,
          recovered: r.recovered * k,
          solid: r.solid * k,
          rqdLength: r.rqdLength * k,
        },
        ctx,
      ),
    )
}
