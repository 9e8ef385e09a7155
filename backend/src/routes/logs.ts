import { Router, type RequestHandler } from 'express'
import multer from 'multer'
import { z } from 'zod'
import type { Db } from '../db/client'
import { projectLocals, requireRole } from '../auth/guards'
import { inputOf, validate } from '../http/validate'
import { ApiError, badRequest, notFound } from '../http/errors'
import { holeOf } from './holes'
import {
  commitLasImport,
  getCurve,
  getImportFile,
  listCurves,
  previewLasImport,
  surveyFromDeviation,
} from '../services/logs'

const ImportParams = z.object({ importId: z.uuid() })
const CurveParams = z.object({ curveId: z.coerce.number().int().positive() })
const depthShift = z.number().min(-1000).max(1000)
/** stored depth = log depth (m) + depthShift; the index is never stored as a curve. */
export const LogCommitBody = z
  .object({
    depthShift: depthShift.default(0),
    curves: z.array(z.string().trim().min(1).max(64)).min(1).max(500).optional(),
  })
  .strict()
export const DeviationSurveyBody = z
  .object({
    interval: z.number().positive().max(1000).default(10),
    depthShift: depthShift.default(0),
  })
  .strict()
/** What multer hands over for the `file` field (memory storage). */
const UploadedFile = z.object({
  fieldname: z.literal('file'),
  originalname: z.string().max(1000),
  size: z.number().int().positive('The file is empty.'),
  buffer: z.instanceof(Buffer),
})

/** UPLOAD_LIMIT_MB as env.ts reads it (default 50); the router is not handed the parsed env. */
export const uploadLimitMb = (source: NodeJS.ProcessEnv = process.env) =>
  z.coerce
    .number()
    .positive()
    .default(50)
    .parse(source.UPLOAD_LIMIT_MB || undefined)

/** Keeps the last path part and drops control characters: the name is shown and sent back. */
export function cleanFileName(name: string): string {
  const base = name.slice(Math.max(name.lastIndexOf('/'), name.lastIndexOf('\\')) + 1)
  let clean = ''
  for (const ch of base) {
    const code = ch.codePointAt(0) ?? 0
    clean += code < 0x20 || code === 0x7f || ch === '"' ? '_' : ch
  }
  clean = clean.trim().slice(0, 200)
  return clean === '' ? 'upload.las' : clean
}

/** One `file` field in memory; multer's own errors become our error shape (413 when too large). */
function uploadOne(limitMb: number): RequestHandler {
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: Math.floor(limitMb * 1024 * 1024), files: 1, fields: 10 },
    defParamCharset: 'utf8',
  }).single('file')
  return (req, res, next) =>
    upload(req, res, (err: unknown) => {
      if (!err) return next()
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') {
          return next(
            new ApiError(413, 'too_large', `The file is larger than the ${limitMb} MB limit.`),
          )
        }
        return next(
          badRequest(`Upload refused: ${err.message}.`, [{ path: 'file', message: err.code }]),
        )
      }
      next(err)
    })
}

/** /api/projects/:projectId/holes/:holeId/logs: LAS upload → preview → commit, and the curves. */
export function logsRouter(db: Db): Router {
  const router = Router({ mergeParams: true })
  const importOf = (params: unknown) => {
    const parsed = ImportParams.safeParse(params)
    if (!parsed.success) throw notFound('Import')
    return parsed.data.importId
  }
  // the hole is checked before the body is read: no 50 MB upload for a hole that is not there
  const loadHole: RequestHandler = async (req, res, next) => {
    res.locals.hole = await holeOf(db, req, res)
    next()
  }
  const hole = (res: { locals: Record<string, unknown> }) =>
    res.locals.hole as Awaited<ReturnType<typeof holeOf>>

  router.get('/', loadHole, async (_req, res) => {
    const curves = await listCurves(db, hole(res).id)
    res.json({ data: curves, meta: { count: curves.length } })
  })

  router.post(
    '/',
    requireRole('logger'),
    loadHole,
    uploadOne(uploadLimitMb()),
    async (req, res) => {
      const file = UploadedFile.safeParse(req.file)
      if (!file.success) {
        const message = req.file
          ? file.error.issues[0].message
          : 'Attach a LAS file in the multipart field "file".'
        throw badRequest(message, [{ path: 'file', message }])
      }
      const upload = { fileName: cleanFileName(file.data.originalname), bytes: file.data.buffer }
      const { project } = projectLocals(res)
      res
        .status(201)
        .json({ data: await previewLasImport(db, req.user!.id, project, hole(res), upload) })
    },
  )

  router.post(
    '/imports/:importId/commit',
    requireRole('logger'),
    loadHole,
    validate({ body: LogCommitBody }),
    async (req, res) => {
      const { body } = inputOf(res, { body: LogCommitBody })
      const { project } = projectLocals(res)
      const importId = importOf(req.params)
      res.json({
        data: await commitLasImport(db, req.user!.id, project, hole(res), importId, body),
      })
    },
  )

  router.post(
    '/imports/:importId/survey-from-deviation',
    requireRole('logger'),
    loadHole,
    validate({ body: DeviationSurveyBody }),
    async (req, res) => {
      const { body } = inputOf(res, { body: DeviationSurveyBody })
      const { project } = projectLocals(res)
      res.json({
        data: await surveyFromDeviation(db, project, hole(res), importOf(req.params), body),
      })
    },
  )

  router.get('/imports/:importId/file', loadHole, async (req, res) => {
    const { project } = projectLocals(res)
    const file = await getImportFile(db, project, hole(res), importOf(req.params))
    res.attachment(file.fileName).type('application/octet-stream').send(file.bytes)
  })

  router.get('/:curveId', loadHole, async (req, res) => {
    const id = CurveParams.safeParse(req.params)
    if (!id.success) throw notFound('Curve')
    res.json({ data: await getCurve(db, hole(res).id, id.data.curveId) })
  })
  return router
}
