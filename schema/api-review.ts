/** Request schemas for domains, intervals and sets (the engineer's review). */
import { z } from 'zod'
import {
  analysisWeightings,
  commentEntities,
  contourMethods,
  structureSources,
  structureTypes,
} from './vocabulary'

const depth = z.number().min(0).max(5000)
const version = z.number().int().positive()
const azimuth = z.number().min(0).max(360)
const limit = z.number().min(0).max(90)

export const DomainBody = z
  .object({ name: z.string().trim().min(1).max(60), description: z.string().max(500).optional() })
  .strict()

const intervalFields = {
  name: z.string().trim().min(1).max(60),
  fromDepth: depth,
  toDepth: depth,
  domainId: z.number().int().positive().nullable(),
  faceDip: z.number().min(0).max(90).nullable(),
  faceDipDirection: azimuth.nullable(),
  frictionDeg: z.number().min(0).max(89).nullable(),
  weighting: z.enum(analysisWeightings),
  contourMethod: z.enum(contourMethods),
  lateralLimitDeg: limit,
  topplingLimitDeg: limit,
}
const ordered = (i: { fromDepth?: number; toDepth?: number }) =>
  i.fromDepth === undefined || i.toDepth === undefined || i.toDepth > i.fromDepth

export const IntervalCreateBody = z
  .object({
    ...intervalFields,
    domainId: intervalFields.domainId.optional(),
    faceDip: intervalFields.faceDip.optional(),
    faceDipDirection: intervalFields.faceDipDirection.optional(),
    frictionDeg: intervalFields.frictionDeg.optional(),
    weighting: intervalFields.weighting.optional(),
    contourMethod: intervalFields.contourMethod.optional(),
    lateralLimitDeg: limit.optional(),
    topplingLimitDeg: limit.optional(),
  })
  .strict()
  .refine(ordered, { path: ['toDepth'], message: 'must be greater than fromDepth' })
export const IntervalUpdateBody = z
  .object(intervalFields)
  .partial()
  .extend({ version })
  .strict()
  .refine(ordered, { path: ['toDepth'], message: 'must be greater than fromDepth' })

const list = <T extends readonly [string, ...string[]]>(values: T) =>
  z
    .string()
    .transform((s) =>
      s
        .split(',')
        .map((x) => x.trim())
        .filter(Boolean),
    )
    .pipe(z.array(z.enum(values)))
    .optional()

/** A number in a query string; an empty value is refused, never read as 0. */
const queryNumber = (min: number, max: number) =>
  z.string().trim().min(1).transform(Number).pipe(z.number().min(min).max(max)).optional()

/**
 * The analysis route's query. Every setting left out is the interval's saved one, so the route
 * without a query answers what the design pack prints; a setting given overrides it for exploring.
 */
export const AnalysisQuery = z
  .object({
    types: list(structureTypes),
    sources: list(structureSources),
    weighting: z.enum(analysisWeightings).optional(),
    contourMethod: z.enum(contourMethods).optional(),
    faceDip: queryNumber(0, 90),
    faceDipDirection: queryNumber(0, 360),
    frictionDeg: queryNumber(0, 89),
    lateralLimitDeg: queryNumber(0, 90),
    topplingLimitDeg: queryNumber(0, 90),
  })
  .strict()

export const SetCreateBody = z
  .object({
    name: z.string().trim().min(1).max(40),
    centreTrend: azimuth,
    centrePlunge: z.number().min(0).max(90),
    coneAngle: z.number().gt(0).max(90),
  })
  .strict()
export const SetUpdateBody = SetCreateBody.partial().extend({ version }).strict()
export const ClusterBody = z.object({ k: z.number().int().min(1).max(12) }).strict()
export const SuggestQuery = z
  .object({ maxK: z.coerce.number().int().min(2).max(12).default(6) })
  .strict()
export const MembersBody = z
  .object({ structureIds: z.array(z.number().int().positive()).max(100000) })
  .strict()

export type IntervalCreate = z.infer<typeof IntervalCreateBody>
export type IntervalUpdate = z.infer<typeof IntervalUpdateBody>
export type AnalysisOptions = z.infer<typeof AnalysisQuery>
export type SetCreate = z.infer<typeof SetCreateBody>
export type SetUpdate = z.infer<typeof SetUpdateBody>

export const ReviewBody = z.object({ version }).strict()
export const ReopenBody = z.object({ version, reason: z.string().trim().min(3).max(1000) }).strict()

export const CommentQuery = z
  .object({ entity: z.enum(commentEntities), entityId: z.coerce.number().int().positive() })
  .strict()
export const CommentBody = z
  .object({
    entity: z.enum(commentEntities),
    entityId: z.number().int().positive(),
    body: z.string().trim().min(1).max(4000),
    /** Members named explicitly; "@email" in the text also mentions a member. */
    mentions: z.array(z.number().int().positive()).max(50).optional(),
  })
  .strict()

export const AuditQuery = z
  .object({
    entity: z.string().max(40).optional(),
    action: z.string().max(40).optional(),
    userId: z.coerce.number().int().positive().optional(),
    from: z.iso.datetime({ offset: true }).optional(),
    to: z.iso.datetime({ offset: true }).optional(),
    before: z.coerce.number().int().positive().optional(),
    limit: z.coerce.number().int().min(1).max(200).default(50),
  })
  .strict()
