/** Request schemas for core-to-image reconciliation and the project's error model. */
import { z } from 'zod'

const positive = (max: number) => z.coerce.number().positive().max(max)

/**
 * `GET H/reconciliation`: the matching window (m, image − core after the estimated shift), the
 * largest angle between matched poles after the run's rotation (degrees), and the verdict
 * thresholds on a run's residual rotation (degrees): at most okAngle → ok, more than wrongAngle →
 * wrong, between → suspect.
 */
export const ReconciliationQuery = z
  .object({
    depthWindow: positive(5).default(1),
    maxAngle: positive(90).default(20),
    okAngle: positive(90).default(5),
    wrongAngle: positive(180).default(15),
    minMatches: z.coerce.number().int().min(2).max(100).default(3),
  })
  .strict()
  .superRefine((q, ctx) => {
    if (q.wrongAngle < q.okAngle)
      ctx.addIssue({ code: 'custom', path: ['wrongAngle'], message: 'must be at least okAngle' })
  })
export type ReconciliationQuery = z.infer<typeof ReconciliationQuery>

/**
 * `POST H/reconciliation/apply`: totals from the logged records (not increments) — the image side's
 * depth shift (image − core, m) and each run's rotation (degrees added to its logged beta values).
 */
export const ReconciliationApplyBody = z
  .object({
    depthShift: z.number().min(-20).max(20).optional(),
    runRotations: z
      .array(
        z
          .object({ runId: z.number().int().positive(), rotation: z.number().min(-180).max(180) })
          .strict(),
      )
      .max(1000)
      .optional(),
    reason: z.string().trim().max(1000).default(''),
  })
  .strict()
  .superRefine((b, ctx) => {
    if (b.depthShift === undefined && !b.runRotations?.length)
      ctx.addIssue({
        code: 'custom',
        path: ['depthShift'],
        message: 'give depthShift or runRotations',
      })
    const ids = (b.runRotations ?? []).map((r) => r.runId)
    const twice = ids.findIndex((id, i) => ids.indexOf(id) !== i)
    if (twice >= 0)
      ctx.addIssue({
        code: 'custom',
        path: ['runRotations', twice, 'runId'],
        message: 'given twice',
      })
  })
export type ReconciliationApplyBody = z.infer<typeof ReconciliationApplyBody>

const sd = (max: number) => z.number().min(0).max(max)

/** The project's error model (1σ per input), every key required; see orient/error-model.ts. */
export const ErrorModelBody = z
  .object({
    surveyAzimuthSdMagnetic: sd(30),
    surveyAzimuthSdGyro: sd(30),
    surveyInclinationSd: sd(10),
    alphaSd: sd(30),
    betaSd: sd(90),
    pickHeightSdMm: sd(200),
    pickTroughSd: sd(90),
    trueDipSd: sd(30),
    trueDipDirectionSd: sd(90),
    depthSd: sd(5),
  })
  .strict()
export type ErrorModelValues = z.infer<typeof ErrorModelBody>

export const ErrorModelUpdateBody = z
  .object({ model: ErrorModelBody, version: z.number().int().positive() })
  .strict()

/** A recorded adjustment as the API answers it. */
export interface AdjustmentAnswer {
  id: number
  kind: 'depth-shift' | 'run-rotation'
  runId: number | null
  value: number
  previous: number
  reason: string
  basis: Record<string, unknown>
  createdAt: string
  createdBy: string | null
  undoneAt: string | null
  undoneBy: string | null
  /** True for the adjustment in force (the newest not undone of its hole or run). */
  active: boolean
}

/** A structure listed as unmatched on its side. */
export interface ReconciliationItem {
  id: number
  depth: number
  type: string
  dip: number | null
  dipDirection: number | null
}

/** `GET H/reconciliation` → `{ data: ReconciliationAnswer }`. Depths in m, angles in degrees. */
export interface ReconciliationAnswer {
  /** Image depth − core depth (logged records), null without matches. */
  depthShift: number | null
  depthShiftSpread: number | null
  /** shift = intercept + slope·(core depth − referenceDepth), when the data support a trend. */
  depthTrend: {
    slope: number
    intercept: number
    referenceDepth: number
    slopeError: number
  } | null
  /** The depth shift in force (0 when none): stored image depths = logged − this. */
  appliedDepthShift: number
  matches: {
    coreStructureId: number
    imageStructureId: number
    coreDepth: number
    /** Logged image depth; the stored (shown) depth is this − appliedDepthShift. */
    imageDepth: number
    depthDifference: number
    angle: number
    alignedAngle: number
    score: number
  }[]
  unmatchedCore: ReconciliationItem[]
  unmatchedImage: ReconciliationItem[]
  runs: {
    runId: number
    fromDepth: number
    toDepth: number
    matched: number
    /** Degrees clockwise looking down-hole to add to the run's logged betas. */
    rotation: number | null
    rotationSpread: number | null
    rotationError: number | null
    appliedRotation: number
    residual: number | null
    verdict: 'ok' | 'suspect' | 'wrong' | null
    reason: string
  }[]
  adjustments: AdjustmentAnswer[]
  options: {
    depthWindow: number
    maxAngle: number
    okAngle: number
    wrongAngle: number
    minMatches: number
  }
  counts: { core: number; image: number }
}

/** `POST H/reconciliation/apply` → 201 `{ data: { adjustments, recomputed } }`; DELETE answers `{ data: { undone, recomputed } }`. */
export interface ReconciliationApplyAnswer {
  adjustments: AdjustmentAnswer[]
  recomputed: number
}

/** `GET /api/projects/:projectId/error-model` → `{ data: ErrorModelAnswer }`; PUT (lead) answers the same. */
export interface ErrorModelAnswer {
  model: ErrorModelValues
  defaults: ErrorModelValues
  /** Keys that differ from the defaults. */
  changed: (keyof ErrorModelValues)[]
  /** The project's version, for the next PUT. */
  version: number
}
