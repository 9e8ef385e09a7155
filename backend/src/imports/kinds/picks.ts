import { z } from 'zod'
import {
  depthUnits,
  imageAzimuthReferences,
  importFieldSpecs,
  importOptionSpecs,
  northReferences,
  parseStructureType,
  pickLengthUnits,
  type StructureType,
} from '../../../../schema/index'
import type { FieldSpec } from '../csv-rows'

const asked = importOptionSpecs.picks
/**
 * How a file of image-log picks is given: the sinusoid (amplitude, diameter, trough azimuth) or a
 * relative dip and dip direction; image azimuths from the high side or from north (magnetic or
 * true); lengths in mm, m or inches.
 */
export const PickImportOptions = z
  .object({
    azimuthReference: z.enum(imageAzimuthReferences).default(asked.azimuthReference.initial),
    northReference: z.enum(northReferences).default(asked.northReference.initial),
    lengthUnit: z.enum(pickLengthUnits).default(asked.lengthUnit.initial),
    depthUnit: z.enum(depthUnits).default(asked.depthUnit.initial),
    /** Borehole diameter for files that give relative dips without a diameter column. */
    holeDiameter: z.number().positive().optional(),
  })
  .strict()
export type PickImportOptionsT = z.infer<typeof PickImportOptions>

export const pickFieldSpecs: readonly FieldSpec[] = importFieldSpecs.picks

/** A pick in the file's stated conventions, lengths in millimetres; north azimuths not yet corrected. */
export interface PickRow {
  depth: number
  type: StructureType
  amplitude: number
  diameter: number
  troughAzimuth: number
  quality?: string
  comment?: string
}

const MM = { mm: 1, m: 1000, in: 25.4 } as const

export function pickRowSchema(options: PickImportOptionsT): z.ZodType<PickRow> {
  const k = MM[options.lengthUnit]
  return z
    .object({
      depth: z.number().min(0).max(5000),
      type: z.string().optional(),
      amplitude: z.number().min(0).optional(),
      diameter: z.number().positive().optional(),
      troughAzimuth: z.number().min(0).max(360).optional(),
      relativeDip: z.number().min(0).max(90).optional(),
      relativeDipDirection: z.number().min(0).max(360).optional(),
      quality: z.string().max(20).optional(),
      comment: z.string().max(1000).optional(),
    })
    .transform((r, ctx): PickRow => {
      const type = r.type === undefined ? 'joint' : parseStructureType(r.type)
      if (!type)
        ctx.addIssue({
          code: 'custom',
          path: ['type'],
          message: `"${r.type}" is not a structure type`,
        })
      const diameter = r.diameter !== undefined ? r.diameter * k : options.holeDiameter
      if (diameter === undefined)
        ctx.addIssue({
          code: 'custom',
          path: ['diameter'],
          message: 'diameter is required (a column or the hole diameter option)',
        })
      let amplitude = r.amplitude !== undefined ? r.amplitude * k : undefined
      let trough = r.troughAzimuth
      // A relative dip δ toward the deepest point is a sinusoid of height D·tan δ (Crain, image-log dip).
      if (amplitude === undefined && r.relativeDip !== undefined && diameter !== undefined) {
        amplitude =
          r.relativeDip >= 90 ? Infinity : diameter * Math.tan((r.relativeDip * Math.PI) / 180)
        trough = trough ?? r.relativeDipDirection
      }
      if (amplitude === undefined || !Number.isFinite(amplitude)) {
        ctx.addIssue({
          code: 'custom',
          path: ['amplitude'],
          message: 'give amplitude (with diameter) or a relative dip below 90',
        })
      }
      if (trough === undefined)
        ctx.addIssue({
          code: 'custom',
          path: ['troughAzimuth'],
          message: 'trough azimuth (or relative dip direction) is required',
        })
      return {
        depth: options.depthUnit === 'ft' ? r.depth * 0.3048 : r.depth,
        type: type ?? 'joint',
        amplitude: amplitude ?? 0,
        diameter: diameter ?? 0,
        troughAzimuth: (trough ?? 0) % 360,
        quality: r.quality,
        comment: r.comment,
      }
    })
}
