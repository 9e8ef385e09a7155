import { z } from 'zod'
import {
  azimuthReferences,
  depthUnits,
  importFieldSpecs,
  importOptionSpecs,
  plungeConventions,
  StationInput,
  type PlungeConvention,
  type StationInputT,
} from '../../../../schema/index'
import type { FieldSpec } from '../csv-rows'
import { validateWith } from './pipe'

const asked = importOptionSpecs.survey
export const SurveyImportOptions = z
  .object({
    plungeConvention: z.enum(plungeConventions).default(asked.plungeConvention.initial),
    azimuthReference: z.enum(azimuthReferences).default(asked.azimuthReference.initial),
    depthUnit: z.enum(depthUnits).default(asked.depthUnit.initial),
  })
  .strict()
export type SurveyImportOptionsT = z.infer<typeof SurveyImportOptions>

export const surveyFieldSpecs: readonly FieldSpec[] = importFieldSpecs.survey

/** Inclination as given → plunge positive down (the one stored convention). */
export function toPlungeDown(value: number, convention: PlungeConvention): number {
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
