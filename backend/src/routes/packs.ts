import { Router, type Request } from 'express'
import { z } from 'zod'
import { projectLocals, requireRole } from '../auth/guards'
import { notFound } from '../http/errors'
import { inputOf, validate } from '../http/validate'
import { PackSelectionBody } from '../services/pack-build'
import { rebuildPack, requestPack, type PackBuildDeps } from '../services/pack-queue'
import { deletePack, getPack, issuePack, listPacks, packFile } from '../services/packs'

const PackParams = z.object({ packId: z.uuid() })
const FileParams = PackParams.extend({ name: z.string().regex(/^[a-z0-9.-]{1,80}$/) })

/** An unknown or malformed pack id reads as not found, like any other id outside the project. */
function packIdOf(req: Request): string {
  const parsed = PackParams.safeParse(req.params)
  if (!parsed.success) throw notFound('Pack')
  return parsed.data.packId
}

/**
 * /api/projects/:projectId/packs: design packs. Builds run as the 'pack-build' job; without a
 * queue (a single process) the build runs in this process after the response.
 */
export function packsRouter(deps: PackBuildDeps): Router {
  const { db } = deps
  const router = Router({ mergeParams: true })
  const lead = requireRole('lead')

  router.get('/', async (_req, res) => {
    res.json({ data: await listPacks(db, projectLocals(res).project.id) })
  })
  router.post('/', lead, validate({ body: PackSelectionBody }), async (req, res) => {
    const { body } = inputOf(res, { body: PackSelectionBody })
    const pack = await requestPack(deps, req.user!.id, projectLocals(res).project, body)
    res.status(202).json({ data: { id: pack.id, status: pack.status, progress: pack.progress } })
  })
  router.get('/:packId', async (req, res) => {
    res.json({ data: await getPack(db, projectLocals(res).project.id, packIdOf(req)) })
  })
  router.post('/:packId/issue', lead, async (req, res) => {
    res.json({
      data: await issuePack(db, req.user!.id, projectLocals(res).project, packIdOf(req)),
    })
  })
  router.post('/:packId/rebuild', lead, async (req, res) => {
    const pack = await rebuildPack(deps, req.user!.id, projectLocals(res).project.id, packIdOf(req))
    res.status(202).json({ data: { id: pack.id, status: pack.status, progress: pack.progress } })
  })
  router.delete('/:packId', lead, async (req, res) => {
    await deletePack(db, req.user!.id, projectLocals(res).project.id, packIdOf(req))
    res.status(204).end()
  })
  router.get('/:packId/files/:name', async (req, res) => {
    const params = FileParams.safeParse(req.params)
    if (!params.success) throw notFound('File')
    const { project, role } = projectLocals(res)
    const file = await packFile(db, project.id, role, params.data.packId, params.data.name)
    res.setHeader('Content-Type', file.mime)
    res.setHeader('Content-Disposition', `attachment; filename="${file.name}"`)
    res.setHeader('X-Content-SHA256', file.sha256)
    res.send(file.bytes)
  })
  return router
}
