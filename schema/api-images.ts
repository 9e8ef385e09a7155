/** Request schemas for televiewer images: uploads, fitting, picks and suggestions. */
import { z } from 'zod'
import {
  confidences,
  imageAzimuthReferences,
  imageKinds,
  imageNorthReferences,
  structureTypes,
} from './vocabulary'

const depth = z.number().min(0).max(5000)
/** Multipart fields arrive as text: numbers are coerced, blanks are "not given". */
const formNumber = (schema: z.ZodNumber) =>
  z.preprocess((v) => (v === '' || v === undefined ? undefined : Number(v)), schema.optional())

/**
 * The fields of `POST H/images` besides the file. Rasters need their depths; a LAS image array
 * takes its depths from the file. Azimuth: the left edge's azimuth from the reference (degrees,
 * clockwise looking down-hole); a north-referenced image says which north.
 */
export const ImageUploadFields = z
  .object({
    topDepth: formNumber(depth),
    bottomDepth: formNumber(depth),
    leftAzimuth: formNumber(z.number().min(-360).max(360)),
    azimuthReference: z.enum(imageAzimuthReferences).default('north'),
    northReference: z.enum(imageNorthReferences).optional(),
    kind: z.enum(imageKinds).optional(),
    diameterMm: formNumber(z.number().min(20).max(2000)),
    /** Set to "true" to store a file that was uploaded to this hole before. */
    confirmDuplicate: z
      .enum(['true', 'false'])
      .optional()
      .transform((v) => v === 'true'),
  })
  .strict()
  .superRefine((f, ctx) => {
    if (f.topDepth !== undefined && f.bottomDepth !== undefined && f.bottomDepth <= f.topDepth)
      ctx.addIssue({ code: 'custom', path: ['bottomDepth'], message: 'must be below topDepth' })
    if (f.azimuthReference === 'highside' && f.northReference !== undefined)
      ctx.addIssue({
        code: 'custom',
        path: ['northReference'],
        message: 'only for north-referenced images',
      })
  })
export type ImageUploadFieldsT = z.infer<typeof ImageUploadFields>

/** A point on the unrolled wall: depth (m) and azimuth in the image's own reference (degrees). */
export const TracePointInput = z.object({ depth, azimuth: z.number().min(-360).max(720) }).strict()
export const TracePoints = z.array(TracePointInput).min(3).max(200)

export const FitBody = z.object({ points: TracePoints }).strict()

export const ImagePickBody = z
  .object({
    points: TracePoints,
    type: z.enum(structureTypes),
    confidence: z.enum(confidences).optional(),
    comment: z.string().max(500).optional(),
    /** The pick began as a suggestion the interpreter accepted. */
    suggested: z.boolean().optional(),
  })
  .strict()
export type ImagePickBodyT = z.infer<typeof ImagePickBody>

/** Moving points, retyping or re-rating a pick; `version` is the structure's. */
export const ImagePickUpdateBody = z
  .object({
    points: TracePoints.optional(),
    type: z.enum(structureTypes).optional(),
    confidence: z.enum(confidences).nullable().optional(),
    comment: z.string().max(500).optional(),
    version: z.number().int().positive(),
  })
  .strict()
export type ImagePickUpdateBodyT = z.infer<typeof ImagePickUpdateBody>

/** The depth window for suggestions: at most 20 m at once. */
export const SuggestionsQuery = z
  .object({ from: z.coerce.number().min(0).max(5000), to: z.coerce.number().min(0).max(5000) })
  .strict()
  .refine((q) => q.to > q.from, { path: ['to'], message: 'must be greater than from' })
  .refine((q) => q.to - q.from <= 20, { path: ['to'], message: 'at most 20 m from "from"' })
