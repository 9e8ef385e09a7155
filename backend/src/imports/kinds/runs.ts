import { z } from 'zod'
import { markConfidences, RunInput, type RunInputT } from '../../../../schema/index'
import type { FieldSpec } from '../csv-rows'
import { validateWith } from './pipe'

export const RunImportOptions = z.object({ depthUnit: z.enum(['m', 'ft']).default('m') }).strict()
export type RunImportOptionsT = z.infer<typeof RunImportOptions>

export const runFieldSpecs: FieldSpec[] = [
  {
    name: 'fromDepth',
    kind: 'number',
    required: true,
    aliases: ['from', 'from_m', 'top', 'depth_from'],
  },
  {
    name: 'toDepth',
    kind: 'number',
    required: true,
    aliases: ['to', 'to_m', 'base', 'bottom', 'depth_to'],
  },
  {
    name: 'recovered',
    kind: 'number',
    required: true,
    aliases: ['recovery', 'recovered_m', 'core_recovered', 'tcr_m'],
  },
  { name: 'solid', kind: 'number', required: true, aliases: ['solid_m', 'solid_core', 'scr_m'] },
  { name: 'rqdLength', kind: 'number', required: true, aliases: ['rqd_m', 'rqd_length', 'rqd'] },
  {
    name: 'fractureCount',
    kind: 'number',
    required: false,
    aliases: ['fractures', 'fracture_count', 'nat_fractures'],
  },
  {
    name: 'markConfidence',
    kind: 'text',
    required: false,
    aliases: ['confidence', 'orientation', 'mark', 'ori_conf'],
  },
  { name: 'comment', kind: 'text', required: false, aliases: ['comments', 'remarks'] },
]

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
