import { Router } from 'express'
import { z } from 'zod'
import { projectLocals, requireRole } from '../auth/guards'
import { holeLocals } from '../auth/load-hole'
import { inputOf, validate } from '../http/validate'
import { cleanFileName, singleUpload } from '../http/upload'
import { csvImportKinds } from '../imports/analyse'
import type { ProjectDeps } from './deps'
import { createImport, getImport, importView, listImports } from '../services/imports'
import { requestImportCommit } from '../services/import-request'
import { undoImport } from '../services/import-undo'

/** A multipart text field holding JSON (mapping, options). */
const jsonField = <T extends z.ZodType>(schema: T) =>
  z
    .string()
    .optional()
    .transform((text, ctx) => {
      if (text === undefined || text.trim() === '') return undefined
      try {
        return JSON.parse(text) as unknown
      } catch {
        ctx.addIssue({ code: 'custom', message: 'is not valid JSON' })
        return z.NEVER
      }
    })
    .pipe(schema.optional())

const UploadBody = z.object({
  kind: z.enum(csvImportKinds),
  mapping: jsonField(z.record(z.string(), z.string())),
  options: jsonField(z.record(z.string(), z.unknown())),
})
const ImportParams = z.object({ importId: z.uuid() })
/** The same file committed here before: the caller must say it means to commit it again. */
const CommitBody = z.object({ confirmDuplicate: z.boolean().optional() }).strict()

/** /api/projects/:projectId/holes/:holeId/imports: CSV upload → preview → commit by id. */
export function importsRouter(deps: ProjectDeps): Router {
  const { db, uploadLimitMb } = deps
  const router = Router({ mergeParams: true })

  router.get('/', async (_req, res) => {
    res.json({ data: await listImports(db, holeLocals(res)) })
  })

  router.post(
    '/',
    requireRole('logger'),
    singleUpload(uploadLimitMb),
    validate({ body: UploadBody }),
    async (req, res) => {
      const { body } = inputOf(res, { body: UploadBody })
      const file = {
        name: cleanFileName(req.file!.originalname, 'upload.csv'),
        buffer: req.file!.buffer,
      }
      const preview = await createImport(
        db,
        req.user!.id,
        projectLocals(res).project,
        holeLocals(res),
        body.kind,
        file,
        body.mapping,
        body.options,
      )
      res.status(201).json({ data: preview })
    },
  )

  router.get('/:importId', validate({ params: ImportParams }), async (_req, res) => {
    const hole = holeLocals(res)
    const { params } = inputOf(res, { params: ImportParams })
    res.json({ data: importView(await getImport(db, hole.projectId, hole.id, params.importId)) })
  })

  // A large import is queued (202) and the page follows its progress; a small one commits now.
  router.post(
    '/:importId/commit',
    requireRole('logger'),
    validate({ params: ImportParams, body: CommitBody }),
    async (req, res) => {
      const { params, body } = inputOf(res, { params: ImportParams, body: CommitBody })
      const confirm = body.confirmDuplicate === true
      const hole = holeLocals(res)
      const done = await requestImportCommit(deps, req.user!.id, hole, params.importId, confirm)
      res.status(done.queued ? 202 : 200).json({ data: done.import })
    },
  )

  router.post(
    '/:importId/undo',
    requireRole('logger'),
    validate({ params: ImportParams }),
    async (req, res) => {
      const { params } = inputOf(res, { params: ImportParams })
      const { project } = projectLocals(res)
      const done = await undoImport(db, req.user!.id, project, holeLocals(res).id, params.importId)
      res.json({
        data: {
          ...importView(done.import),
          removed: done.removed,
          restored: done.restored,
          recomputed: done.recomputed,
        },
      })
    },
  )
  return router
}
