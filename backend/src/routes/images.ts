import { Router } from 'express'
import { z } from 'zod'
import { IdParam, ImageUploadFields } from '../../../schema/index'
import { requireRole } from '../auth/guards'
import { holeLocals } from '../auth/load-hole'
import { badRequest } from '../http/errors'
import { cleanFileName, singleUpload } from '../http/upload'
import { inputOf, validate } from '../http/validate'
import { ingestImages } from '../services/image-ingest'
import { deleteImage, getImageMeta, getTile, imageFile, listImages } from '../services/images'
import type { ProjectDeps } from './deps'

const ImageParams = IdParam('imageId')
const TileParams = ImageParams.extend({
  level: z.coerce.number().int().min(0).max(40),
  tile: z.coerce.number().int().min(0),
})
/** What multer hands over for the `file` field (memory storage). */
const UploadedFile = z.object({
  originalname: z.string().max(1000),
  size: z.number().int().positive('The file is empty.'),
  buffer: z.instanceof(Buffer),
})

/** /api/projects/:projectId/holes/:holeId/images: upload, list, one image, its file and tiles. */
export function imagesRouter(deps: ProjectDeps): Router {
  const { db } = deps
  const router = Router({ mergeParams: true })

  router.get('/', async (_req, res) => {
    const rows = await listImages(db, holeLocals(res).id)
    res.json({ data: rows, meta: { count: rows.length } })
  })

  // 201 when every image is tiled now; 202 when the job tiles it (status processing)
  router.post(
    '/',
    requireRole('logger'),
    singleUpload(deps.imageUploadLimitMb),
    validate({ body: ImageUploadFields }),
    async (req, res) => {
      const { body } = inputOf(res, { body: ImageUploadFields })
      const file = UploadedFile.safeParse(req.file)
      if (!file.success) {
        const message = file.error.issues[0].message
        throw badRequest(message, [{ path: 'file', message }])
      }
      const upload = {
        fileName: cleanFileName(file.data.originalname, 'image'),
        bytes: file.data.buffer,
      }
      const done = await ingestImages(deps, req.user!.id, holeLocals(res), upload, body)
      res
        .status(done.queued ? 202 : 201)
        .json({ data: done.images[0], meta: { images: done.images } })
    },
  )

  router.get('/:imageId', validate({ params: ImageParams }), async (_req, res) => {
    const { params } = inputOf(res, { params: ImageParams })
    res.json({ data: await getImageMeta(db, holeLocals(res).id, params.imageId) })
  })

  router.delete(
    '/:imageId',
    requireRole('logger'),
    validate({ params: ImageParams }),
    async (req, res) => {
      const { params } = inputOf(res, { params: ImageParams })
      await deleteImage(db, req.user!.id, holeLocals(res), params.imageId)
      res.status(204).end()
    },
  )

  router.get('/:imageId/file', validate({ params: ImageParams }), async (_req, res) => {
    const { params } = inputOf(res, { params: ImageParams })
    const file = await imageFile(db, holeLocals(res).id, params.imageId)
    res.attachment(file.fileName)
    // as stored, no charset added: a LAS file may be UTF-16 or Windows-1252
    res.setHeader('Content-Type', file.mediaType)
    res.setHeader('Content-Length', String(file.fileSize))
    for await (const chunk of file.chunks) res.write(chunk)
    res.end()
  })

  // The stored deflated bytes as they are: the browser inflates them (Content-Encoding).
  router.get(
    '/:imageId/tiles/:level/:tile',
    validate({ params: TileParams }),
    async (_req, res) => {
      const { params } = inputOf(res, { params: TileParams })
      const { level, tile, imageId } = params
      const found = await getTile(db, holeLocals(res).id, imageId, level, tile)
      res.set({
        'Content-Type': 'application/octet-stream',
        'Content-Encoding': 'deflate',
        'X-Tile-Rows': String(found.rows),
        ETag: found.etag,
        'Cache-Control': 'private, max-age=3600',
      })
      res.send(found.bytes)
    },
  )
  return router
}
