/**
 * Request schemas for the API, derived from the tables with drizzle-zod so the database and the
 * API cannot drift; ranges are added where the trade has them. Shared by backend (validation) and
 * frontend (types).
 */
import { createInsertSchema } from 'drizzle-zod'
import { z } from 'zod'
import { holes, surveyStations } from './holes'
import { projects } from './projects'
import { projectRoles } from './vocabulary'
import { users } from './users'

const azimuth = z.number().min(0).max(360)
const version = z.number().int().positive()

export const ProjectCreateBody = createInsertSchema(projects, {
  code: (s) => s.trim().regex(/^[A-Z0-9][A-Z0-9_-]{1,15}$/, 'upper-case letters, digits, - or _'),
  name: (s) => s.trim().min(1).max(120),
  crsEpsg: (s) => s.int().min(1024).max(999999),
  declinationDeg: (s) => s.min(-90).max(90),
  gridConvergenceDeg: (s) => s.min(-10).max(10),
  steepThresholdDeg: (s) => s.min(45).max(90),
  betaJumpDeg: (s) => s.min(5).max(180),
})
  .pick({
    code: true,
    name: true,
    crsEpsg: true,
    declinationMode: true,
    declinationDeg: true,
    convergenceMode: true,
    gridConvergenceDeg: true,
    referenceLine: true,
    steepThresholdDeg: true,
    netProjection: true,
    betaJumpDeg: true,
  })
  .extend({ leadUserId: z.number().int().positive() })
  .strict()

export const ProjectUpdateBody = ProjectCreateBody.omit({ code: true, leadUserId: true })
  .partial()
  // Four eyes is a lead's later decision, not part of creating a project (it starts on).
  .extend({ version, fourEyes: z.boolean().optional() })
  .strict()

export const MemberAddBody = z
  .object({ email: z.string().trim().toLowerCase().email().max(254), role: z.enum(projectRoles) })
  .strict()
export const MemberUpdateBody = z.object({ role: z.enum(projectRoles) }).strict()

export const HoleCreateBody = createInsertSchema(holes, {
  name: (s) => s.trim().min(1).max(60),
  plannedAzimuth: () => azimuth,
  plannedPlunge: (s) => s.min(-90).max(90),
  finalDepth: (s) => s.positive().max(5000),
  coreSize: (s) => s.trim().max(20),
  startDate: () => z.iso.date().nullable(),
})
  .pick({
    name: true,
    collarEast: true,
    collarNorth: true,
    collarElevation: true,
    plannedAzimuth: true,
    plannedPlunge: true,
    finalDepth: true,
    coreSize: true,
    startDate: true,
    status: true,
  })
  .strict()
export const HoleUpdateBody = HoleCreateBody.partial().extend({ version }).strict()

/** A station as entered: azimuth in the stated reference, plunge positive down. */
export const StationInput = createInsertSchema(surveyStations, {
  depth: (s) => s.min(0).max(5000),
  azimuth: () => azimuth,
  plunge: (s) => s.min(-90).max(90),
  method: (s) => s.trim().max(60),
  surveyedOn: () => z.iso.date().nullable(),
})
  .pick({
    depth: true,
    azimuth: true,
    plunge: true,
    azimuthReference: true,
    method: true,
    surveyedOn: true,
  })
  .strict()
export const StationUpdateBody = StationInput.partial().extend({ version }).strict()
export const SurveyReplaceBody = z
  .object({ stations: z.array(StationInput).max(10000) })
  .strict()
  .superRefine((body, ctx) => {
    const seen = new Map<number, number>()
    body.stations.forEach((s, i) => {
      const first = seen.get(s.depth)
      if (first !== undefined) {
        ctx.addIssue({
          code: 'custom',
          path: ['stations', i, 'depth'],
          message: `depth ${s.depth} repeats station ${first}`,
        })
      } else seen.set(s.depth, i)
    })
  })

export const UserCreateBody = createInsertSchema(users, {
  email: (s) => s.trim().toLowerCase().email().max(254),
  name: (s) => s.trim().min(1).max(120),
})
  .pick({ email: true, name: true, isAdmin: true })
  .extend({ password: z.string().min(10).max(200) })
  .strict()
export const UserUpdateBody = z
  .object({
    version,
    name: z.string().trim().min(1).max(120).optional(),
    isAdmin: z.boolean().optional(),
    disabled: z.boolean().optional(),
  })
  .strict()

export const IdParam = (name: string) => z.object({ [name]: z.coerce.number().int().positive() })

/** Keys an insert into the table may leave out: the column has a default or takes null. */
type OmittableKeys<Insert> = {
  [K in keyof Insert]-?: object extends Pick<Insert, K> ? K : never
}[keyof Insert]
/**
 * What a schema accepts: drizzle-zod types a refined column that has a default, or is nullable, as
 * required, although the schema lets it be left out (drizzle-team/drizzle-orm#4706).
 */
type Accepted<T, Insert> = Omit<T, OmittableKeys<Insert>> &
  Partial<Pick<T, Extract<keyof T, OmittableKeys<Insert>>>>

export type ProjectCreate = Accepted<
  z.infer<typeof ProjectCreateBody>,
  typeof projects.$inferInsert
>
export type ProjectUpdate = z.infer<typeof ProjectUpdateBody>
export type HoleCreate = Accepted<z.infer<typeof HoleCreateBody>, typeof holes.$inferInsert>
export type HoleUpdate = z.infer<typeof HoleUpdateBody>
export type StationInputT = Accepted<
  z.infer<typeof StationInput>,
  typeof surveyStations.$inferInsert
>
export type UserCreate = z.infer<typeof UserCreateBody>
export type UserUpdate = z.infer<typeof UserUpdateBody>
