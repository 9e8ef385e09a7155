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
import {
  BACKGROUND_ROWS,
  commitImport,
  createImport,
  getImport,
  importView,
  queueImport,
} from '../services/imports'

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
    validate({ params: ImportParams }),
    async (req, res) => {
      const hole = await holeOf(db, req, res)
      const { params } = inputOf(res, { params: ImportParams })
      const found = await getImport(db, hole.projectId, hole.id, params.importId)
      if (jobs && found.rowCount > BACKGROUND_ROWS) {
        await queueImport(db, found.id)
        await jobs.send('import-commit', { importId: found.id, actorId: req.user!.id })
        res
          .status(202)
          .json({ data: importView(await getImport(db, hole.projectId, hole.id, found.id)) })
        return
      }
      await commitImport(db, pool, found.id, { fromJob: false, actorId: req.user!.id })
      res.json({ data: importView(await getImport(db, hole.projectId, hole.id, found.id)) })
    },
  )
  return router
}
