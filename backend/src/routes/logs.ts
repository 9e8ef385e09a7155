import { Router } from 'express'
import { z } from 'zod'
import type { Db } from '../db/client'
import { projectLocals, requireRole } from '../auth/guards'
import { holeLocals } from '../auth/load-hole'
import { inputOf, validate } from '../http/validate'
import { badRequest, notFound } from '../http/errors'
import { cleanFileName, singleUpload } from '../http/upload'
import { getCurve, listCurves } from '../services/log-curves'
import {
  commitLasImport,
  getImportFile,
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

/**
 * /api/projects/:projectId/holes/:holeId/logs: LAS upload → preview → commit, and the curves.
 * loadHole has found the hole before any upload is read.
 */
export function logsRouter(db: Db, uploadLimitMb: number): Router {
  const router = Router({ mergeParams: true })
  const importOf = (params: unknown) => {
    const parsed = ImportParams.safeParse(params)
    if (!parsed.success) throw notFound('Import')
    return parsed.data.importId
  }
  router.get('/', async (_req, res) => {
    const curves = await listCurves(db, holeLocals(res).id)
    res.json({ data: curves, meta: { count: curves.length } })
  })

  router.post('/', requireRole('logger'), singleUpload(uploadLimitMb), async (req, res) => {
    const file = UploadedFile.safeParse(req.file)
    if (!file.success) {
      const message = req.file
        ? file.error.issues[0].message
        : 'Attach a LAS file in the multipart field "file".'
      throw badRequest(message, [{ path: 'file', message }])
    }
    const upload = {
      fileName: cleanFileName(file.data.originalname, 'upload.las'),
      bytes: file.data.buffer,
    }
    const { project } = projectLocals(res)
    res
      .status(201)
      .json({ data: await previewLasImport(db, req.user!.id, project, holeLocals(res), upload) })
  })

  router.post(
    '/imports/:importId/commit',
    requireRole('logger'),
    validate({ body: LogCommitBody }),
    async (req, res) => {
      const { body } = inputOf(res, { body: LogCommitBody })
      const { project } = projectLocals(res)
      const importId = importOf(req.params)
      res.json({
        data: await commitLasImport(db, req.user!.id, project, holeLocals(res), importId, body),
      })
    },
  )

  router.post(
    '/imports/:importId/survey-from-deviation',
    requireRole('logger'),
    validate({ body: DeviationSurveyBody }),
    async (req, res) => {
      const { body } = inputOf(res, { body: DeviationSurveyBody })
      const { project } = projectLocals(res)
      res.json({
        data: await surveyFromDeviation(db, project, holeLocals(res), importOf(req.params), body),
      })
    },
  )

  router.get('/imports/:importId/file', async (req, res) => {
    const { project } = projectLocals(res)
    const file = await getImportFile(db, project, holeLocals(res), importOf(req.params))
    res.attachment(file.fileName).type('application/octet-stream').send(file.bytes)
  })

  router.get('/:curveId', async (req, res) => {
    const id = CurveParams.safeParse(req.params)
    if (!id.success) throw notFound('Curve')
    res.json({ data: await getCurve(db, holeLocals(res).id, id.data.curveId) })
  })
  return router
}
