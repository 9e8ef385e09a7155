import { Router } from 'express'
import { z } from 'zod'
import { desc, and, eq } from 'drizzle-orm'
import type pg from 'pg'
import { imports } from '../../../schema/index'
import type { Db } from '../db/client'
import type { JobQueue } from '../jobs/queue'
import { projectLocals, requireRole } from '../auth/guards'
import { inputOf, validate } from '../http/validate'
import { cleanFileName, singleUpload } from '../http/upload'
import { csvImportKinds } from '../imports/analyse'
import { holeOf } from './holes'
import { BACKGROUND_ROWS, createImport, getImport, importView } from '../services/imports'
import { commitImport, queueImport } from '../services/import-commit'
import { assertNotDuplicate } from '../services/import-guards'
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

export interface ImportDeps {
  db: Db
  pool: pg.Pool
  jobs?: JobQueue
  uploadLimitMb: number
}

/** /api/projects/:projectId/holes/:holeId/imports: CSV upload → preview → commit by id. */
export function importsRouter({ db, pool, jobs, uploadLimitMb }: ImportDeps): Router {
  const router = Router({ mergeParams: true })

  router.get('/', async (req, res) => {
    const hole = await holeOf(db, req, res)
    const rows = await db
      .select()
      .from(imports)
      .where(and(eq(imports.holeId, hole.id), eq(imports.projectId, hole.projectId)))
      .orderBy(desc(imports.createdAt))
      .limit(50)
    res.json({ data: rows.map(importView) })
  })

  router.post(
    '/',
    requireRole('logger'),
    singleUpload(uploadLimitMb),
    validate({ body: UploadBody }),
    async (req, res) => {
      const hole = await holeOf(db, req, res)
      const { body } = inputOf(res, { body: UploadBody })
      const file = {
        name: cleanFileName(req.file!.originalname, 'upload.csv'),
        buffer: req.file!.buffer,
      }
      const preview = await createImport(
        db,
        req.user!.id,
        projectLocals(res).project,
        hole,
        body.kind,
        file,
        body.mapping,
        body.options,
      )
      res.status(201).json({ data: preview })
    },
  )

  router.get('/:importId', validate({ params: ImportParams }), async (req, res) => {
    const hole = await holeOf(db, req, res)
    const { params } = inputOf(res, { params: ImportParams })
    res.json({ data: importView(await getImport(db, hole.projectId, hole.id, params.importId)) })
  })

  router.post(
    '/:importId/commit',
    requireRole('logger'),
    validate({ params: ImportParams, body: CommitBody }),
    async (req, res) => {
      const hole = await holeOf(db, req, res)
      const { params, body } = inputOf(res, { params: ImportParams, body: CommitBody })
      const found = await getImport(db, hole.projectId, hole.id, params.importId)
      const confirmDuplicate = body.confirmDuplicate === true
      if (jobs && found.rowCount > BACKGROUND_ROWS) {
        // Refused before queueing so the caller hears it now; the job checks again.
        if (found.status === 'previewed') await assertNotDuplicate(db, found, confirmDuplicate)
        const attempt = await queueImport(db, found.id)
        await jobs.send('import-commit', {
          importId: found.id,
          attempt,
          actorId: req.user!.id,
          confirmDuplicate,
        })
        res
          .status(202)
          .json({ data: importView(await getImport(db, hole.projectId, hole.id, found.id)) })
        return
      }
      await commitImport(db, pool, found.id, {
        fromJob: false,
        actorId: req.user!.id,
        confirmDuplicate,
      })
      res.json({ data: importView(await getImport(db, hole.projectId, hole.id, found.id)) })
    },
  )

  router.post(
    '/:importId/undo',
    requireRole('logger'),
    validate({ params: ImportParams }),
    async (req, res) => {
      const hole = await holeOf(db, req, res)
      const { params } = inputOf(res, { params: ImportParams })
      const { project } = projectLocals(res)
      const done = await undoImport(db, req.user!.id, project, hole.id, params.importId)
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
