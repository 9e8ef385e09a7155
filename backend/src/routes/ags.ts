import { Router, type Request } from 'express'
import { z } from 'zod'
import { AgsDictionaryUploadFields, AgsEditionParam } from '../../../schema/index'
import type { Db } from '../db/client'
import { requireAdmin } from '../auth/guards'
import { badRequest } from '../http/errors'
import { cleanFileName, singleUpload } from '../http/upload'
import { inputOf, validate } from '../http/validate'
import { checkAgsFile } from '../services/ags-validate'
import { listDictionaries, loadDictionary, removeDictionary } from '../services/ags-dictionaries'

const UploadedFile = z.object({
  fieldname: z.literal('file'),
  originalname: z.string().max(1000),
  size: z.number().int().positive('The file is empty.'),
  buffer: z.instanceof(Buffer),
})
/** The check's upload carries the file alone: any other multipart field is refused by name. */
const CheckBody = z.object({}).strict()

function uploaded(req: Request) {
  const file = UploadedFile.safeParse(req.file)
  if (!file.success) {
    const message = file.error.issues[0].message
    throw badRequest(message, [{ path: 'file', message }])
  }
  return { name: cleanFileName(file.data.originalname, 'upload.ags'), buffer: file.data.buffer }
}

/**
 * /api/ags (mounted behind requireSignedIn): any signed-in user checks an AGS4 file against the
 * AGS4 rules, nothing stored, and sees which standard dictionaries are loaded; an administrator
 * loads, replaces and removes an edition's dictionary.
 */
export function agsRouter(db: Db, uploadLimitMb: number): Router {
  const router = Router()
  router.post(
    '/validate',
    singleUpload(uploadLimitMb),
    validate({ body: CheckBody }),
    async (req, res) => {
      res.json({ data: await checkAgsFile(db, uploaded(req)) })
    },
  )

  router.get('/dictionaries', async (_req, res) => {
    const rows = await listDictionaries(db)
    res.json({ data: rows, meta: { count: rows.length } })
  })
  // The role is checked before the upload is read.
  router.post(
    '/dictionaries',
    requireAdmin,
    singleUpload(uploadLimitMb),
    validate({ body: AgsDictionaryUploadFields }),
    async (req, res) => {
      const { body } = inputOf(res, { body: AgsDictionaryUploadFields })
      const { name, buffer } = uploaded(req)
      const upload = { fileName: name, bytes: buffer }
      const { row, replaced } = await loadDictionary(db, req.user!.id, upload, body)
      res.status(replaced ? 200 : 201).json({ data: row, meta: { replaced } })
    },
  )
  router.delete(
    '/dictionaries/:edition',
    requireAdmin,
    validate({ params: AgsEditionParam }),
    async (req, res) => {
      const { params } = inputOf(res, { params: AgsEditionParam })
      await removeDictionary(db, req.user!.id, params.edition)
      res.status(204).end()
    },
  )
  return router
}
