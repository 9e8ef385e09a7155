import { z } from 'zod'
import { azimuthReferences, StationInput, type StationInputT } from '../../../../schema/index'
import type { FieldSpec } from '../csv-rows'
import { validateWith } from './pipe'

/** How the file gives inclination: plunge positive down, dip negative down, or from vertical. */
export const plungeConventions = [
  'plunge-down',
  'dip-negative-down',
  'inclination-from-vertical',
] as const

export const SurveyImportOptions = z
  .object({
    plungeConvention: z.enum(plungeConventions).default('plunge-down'),
    azimuthReference: z.enum(azimuthReferences).default('magnetic'),
    depthUnit: z.enum(['m', 'ft']).default('m'),
  })
  .strict()
export type SurveyImportOptionsT = z.infer<typeof SurveyImportOptions>

export const surveyFieldSpecs: FieldSpec[] = [
  { name: 'depth', kind: 'number', required: true, aliases: ['md', 'depth_m', 'station'] },
  { name: 'azimuth', kind: 'number', required: true, aliases: ['azi', 'az', 'bearing'] },
  {
    name: 'plunge',
    kind: 'number',
    required: true,
    aliases: ['dip', 'inclination', 'incl', 'inc'],
  },
  { name: 'method', kind: 'text', required: false, aliases: ['tool', 'instrument'] },
  { name: 'surveyedOn', kind: 'text', required: false, aliases: ['date', 'survey_date'] },
]

/** Inclination as given → plunge positive down (the one stored convention). */
export function toPlungeDown(
  value: number,
  convention: (typeof plungeConventions)[number],
): number {
  if (convention === 'dip-negative-down') return -value
  if (convention === 'inclination-from-vertical') return 90 - value
  return value
}

export function surveyRowSchema(options: SurveyImportOptionsT): z.ZodType<StationInputT> {
  const range =
    options.plungeConvention === 'inclination-from-vertical'
      ? z.number().min(0).max(180)
      : z.number().min(-90).max(90)
  return z
    .object({
      depth: z.number(),
      azimuth: z.number().min(0).max(360),
      plunge: range,
      method: z.string().default(''),
      surveyedOn: z.iso.date().nullable().default(null),
    })
    .transform((r, ctx) =>
      validateWith(
        StationInput,
        {
          ...r,
          depth: options.depthUnit === 'ft' ? r.depth * 0.3048 : r.depth,
          plunge: toPlungeDown(r.plunge, options.plungeConvention),
          azimuth: r.azimuth % 360,
          azimuthReference: options.azimuthReference,
        },
        ctx,
      ),
    )
}
