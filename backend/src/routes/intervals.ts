import { Router } from 'express'
import { z } from 'zod'
import {
  AnalysisQuery,
  ClusterBody,
  IdParam,
  IntervalCreateBody,
  IntervalUpdateBody,
  MembersBody,
  ReopenBody,
  ReviewBody,
  SetCreateBody,
  SetUpdateBody,
  SuggestQuery,
} from '../../../schema/index'
import { projectLocals, requireRole } from '../auth/guards'
import { holeLocals } from '../auth/load-hole'
import type { Db } from '../db/client'
import { notFound } from '../http/errors'
import { inputOf, validate } from '../http/validate'
import type { ProjectDeps } from './deps'
import { analyseInterval } from '../services/analysis'
import { reviewStep, submitForChecking } from '../services/review'
import {
  createInterval,
  deleteInterval,
  getInterval,
  listIntervals,
  updateInterval,
} from '../services/intervals'
import {
  clusterInterval,
  createConeSet,
  deleteSet,
  setMembersOf,
  suggestSetCount,
  updateSet,
} from '../services/sets'

const IntervalParams = IdParam('intervalId')
const SetParams = z.object({ setId: z.coerce.number().int().positive() })
const VersionQuery = z.object({ version: z.coerce.number().int().positive() })

/** The hole loadHole found and the interval named by :intervalId in it, or 404. */
async function intervalOf(
  db: Db,
  req: { params: unknown },
  res: { locals: Record<string, unknown> },
) {
  const hole = holeLocals(res)
  const id = IntervalParams.safeParse(req.params)
  if (!id.success) throw notFound('Interval')
  return { hole, interval: await getInterval(db, hole.id, id.data.intervalId) }
}

/** /api/projects/:projectId/holes/:holeId/intervals: intervals, their sets and their analysis. */
export function intervalsRouter({ db, mail }: Pick<ProjectDeps, 'db' | 'mail'>): Router {
  const router = Router({ mergeParams: true })
  const engineer = requireRole('engineer')
  const actorOf = (req: { user?: Express.User }, res: { locals: Record<string, unknown> }) => ({
    id: req.user!.id,
    name: req.user!.name,
    role: projectLocals(res).role,
  })

  router.get('/', async (_req, res) => {
    res.json({ data: await listIntervals(db, holeLocals(res).id) })
  })
  router.post('/', engineer, validate({ body: IntervalCreateBody }), async (req, res) => {
    const { body } = inputOf(res, { body: IntervalCreateBody })
    res.status(201).json({ data: await createInterval(db, req.user!.id, holeLocals(res), body) })
  })
  router.get('/:intervalId', async (req, res) => {
    const { hole, interval } = await intervalOf(db, req, res)
    res.json({ data: (await listIntervals(db, hole.id)).find((i) => i.id === interval.id) })
  })
  router.patch(
    '/:intervalId',
    engineer,
    validate({ body: IntervalUpdateBody }),
    async (req, res) => {
      const { hole, interval } = await intervalOf(db, req, res)
      const { body } = inputOf(res, { body: IntervalUpdateBody })
      res.json({ data: await updateInterval(db, mail, req.user!.id, hole, interval.id, body) })
    },
  )
  router.delete('/:intervalId', engineer, validate({ query: VersionQuery }), async (req, res) => {
    const { hole, interval } = await intervalOf(db, req, res)
    const { query } = inputOf(res, { query: VersionQuery })
    await deleteInterval(db, req.user!.id, hole, interval.id, query.version)
    res.status(204).end()
  })
  router.get('/:intervalId/analysis', validate({ query: AnalysisQuery }), async (req, res) => {
    const { interval } = await intervalOf(db, req, res)
    const { query } = inputOf(res, { query: AnalysisQuery })
    res.json({ data: await analyseInterval(db, interval, query) })
  })

  for (const step of ['check', 'approve', 'reopen'] as const) {
    const Body = step === 'reopen' ? ReopenBody : ReviewBody
    router.post(`/:intervalId/${step}`, engineer, validate({ body: Body }), async (req, res) => {
      const { hole, interval } = await intervalOf(db, req, res)
      const { body } = inputOf(res, { body: Body })
      const actor = actorOf(req, res)
      res.json({ data: await reviewStep(db, mail, actor, hole, interval.id, step, body) })
    })
  }
  router.post('/:intervalId/submit', requireRole('logger'), async (req, res) => {
    const { hole, interval } = await intervalOf(db, req, res)
    res.json({ data: await submitForChecking(db, mail, actorOf(req, res), hole, interval) })
  })

  router.get('/:intervalId/sets/suggest', validate({ query: SuggestQuery }), async (req, res) => {
    const { interval } = await intervalOf(db, req, res)
    const { query } = inputOf(res, { query: SuggestQuery })
    res.json({ data: await suggestSetCount(db, interval, query.maxK) })
  })
  router.post(
    '/:intervalId/sets',
    engineer,
    validate({ body: SetCreateBody }),
    async (req, res) => {
      const { hole, interval } = await intervalOf(db, req, res)
      const { body } = inputOf(res, { body: SetCreateBody })
      const row = await createConeSet(db, mail, req.user!.id, hole, interval, body)
      res.status(201).json({ data: row })
    },
  )
  router.post(
    '/:intervalId/sets/cluster',
    engineer,
    validate({ body: ClusterBody }),
    async (req, res) => {
      const { hole, interval } = await intervalOf(db, req, res)
      const { body } = inputOf(res, { body: ClusterBody })
      res.json({ data: await clusterInterval(db, mail, req.user!.id, hole, interval, body.k) })
    },
  )
  router.patch(
    '/:intervalId/sets/:setId',
    engineer,
    validate({ params: SetParams, body: SetUpdateBody }),
    async (req, res) => {
      const { hole, interval } = await intervalOf(db, req, res)
      const { params, body } = inputOf(res, { params: SetParams, body: SetUpdateBody })
      const row = await updateSet(db, mail, req.user!.id, hole, interval, params.setId, body)
      res.json({ data: row })
    },
  )
  router.delete(
    '/:intervalId/sets/:setId',
    engineer,
    validate({ params: SetParams }),
    async (req, res) => {
      const { hole, interval } = await intervalOf(db, req, res)
      const { params } = inputOf(res, { params: SetParams })
      await deleteSet(db, mail, req.user!.id, hole, interval, params.setId)
      res.status(204).end()
    },
  )
  router.put(
    '/:intervalId/sets/:setId/members',
    engineer,
    validate({ params: SetParams, body: MembersBody }),
    async (req, res) => {
      const { hole, interval } = await intervalOf(db, req, res)
      const { params, body } = inputOf(res, { params: SetParams, body: MembersBody })
      const ids = body.structureIds
      res.json({
        data: await setMembersOf(db, mail, req.user!.id, hole, interval, params.setId, ids),
      })
    },
  )
  return router
}
