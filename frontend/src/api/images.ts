import { API_BASE, ApiError, api, seg } from './client'
import type { IdParam } from './types'
import type {
  ImageAzimuthReference,
  ImageKind,
  ImageNorthReference,
} from '../../../schema/vocabulary'

/** A televiewer image as the API sends it (GET H/images, GET H/images/:imageId). */
export interface ImageMeta {
  id: number
  holeId: number
  kind: ImageKind
  source: 'raster' | 'las'
  name: string
  fileName: string
  mediaType: string
  fileSize: number
  topDepth: number
  bottomDepth: number
  /** Samples per turn. */
  width: number
  /** Rows at full resolution. */
  height: number
  channels: 1 | 3
  sampleBits: 8 | 16
  valueMin: number | null
  valueMax: number | null
  valueUnit: string | null
  leftAzimuth: number
  azimuthReference: ImageAzimuthReference
  northReference: ImageNorthReference | null
  diameterMm: number
  diameterSource: string
  tileRows: number
  levels: number
  status: 'processing' | 'ready' | 'failed'
  progress: number
  message: string
  notes: string[]
  createdAt: string
  createdBy: number | null
  /** Picks made on this image. */
  pickCount: number
}

export interface TracePoint {
  depth: number
  /** Degrees in the image's own reference (north or high side), clockwise looking down-hole. */
  azimuth: number
}

/** A fitted sinusoid: centre depth (m), height peak to trough (mm), trough azimuth (image ref). */
export interface FitResult {
  depth: number
  height: number
  troughAzimuth: number
  rmsMm: number
  dip: number | null
  dipDirection: number | null
}

export interface Suggestion {
  depth: number
  height: number
  troughAzimuth: number
  dip: number | null
  dipDirection: number | null
  score: number
}

/** The raw pick behind an image structure (GET H/images/:imageId/picks). */
export interface ImagePickRecord {
  structureId: number
  imageId: number | null
  points: TracePoint[]
  centreDepth: number
  heightMm: number
  troughAzimuth: number
  diameterMm: number
  azimuthReference: ImageAzimuthReference
  northReference: ImageNorthReference | null
  rmsMm: number
  suggested: boolean
  /** The structure as stored (type, confidence, dip, dipDirection, version, flags…). */
  structure: {
    id: number
    depth: number
    type: string
    confidence: string | null
    comment: string
    dip: number | null
    dipDirection: number | null
    flags: string[]
    version: number
  }
}

export interface ImageUpload {
  file: File
  topDepth?: number
  bottomDepth?: number
  leftAzimuth?: number
  azimuthReference: ImageAzimuthReference
  northReference?: ImageNorthReference
  kind?: ImageKind
  diameterMm?: number
  confirmDuplicate?: boolean
}

const imagesPath = (projectId: IdParam, holeId: IdParam) =>
  `/projects/${seg(projectId)}/holes/${seg(holeId)}/images`

export const listImages = (projectId: IdParam, holeId: IdParam) =>
  api.get<ImageMeta[]>(imagesPath(projectId, holeId))

export const getImage = (projectId: IdParam, holeId: IdParam, imageId: IdParam) =>
  api.get<ImageMeta>(`${imagesPath(projectId, holeId)}/${seg(imageId)}`)

/** 201 with the image (small files, tiled at once) or 202 with it still processing. */
export function uploadImage(projectId: IdParam, holeId: IdParam, u: ImageUpload) {
  const form = new FormData()
  for (const [k, v] of Object.entries(u)) {
    if (k === 'file' || v === undefined) continue
    form.append(k, String(v))
  }
  form.append('file', u.file, u.file.name)
  return api.upload<ImageMeta>(imagesPath(projectId, holeId), form)
}

export const deleteImage = (projectId: IdParam, holeId: IdParam, imageId: IdParam) =>
  api.delete<void>(`${imagesPath(projectId, holeId)}/${seg(imageId)}`)

export const imageFileUrl = (projectId: IdParam, holeId: IdParam, imageId: IdParam) =>
  `${API_BASE}${imagesPath(projectId, holeId)}/${seg(imageId)}/file`

/**
 * One tile of the pyramid as raw samples: `rows` × width × channels, uint8 or uint16 (the image's
 * sampleBits). The server sends it zlib-deflated with Content-Encoding: deflate, so the browser
 * inflates it.
 */
export async function fetchTile(
  projectId: IdParam,
  holeId: IdParam,
  image: Pick<ImageMeta, 'id' | 'sampleBits'>,
  level: number,
  tile: number,
  signal?: AbortSignal,
): Promise<{ rows: number; samples: Uint8Array | Uint16Array }> {
  const url = `${API_BASE}${imagesPath(projectId, holeId)}/${seg(image.id)}/tiles/${level}/${tile}`
  const response = await fetch(url, { credentials: 'same-origin', signal })
  if (!response.ok) throw new ApiError(response.status, 'tile', `Tile ${level}/${tile} failed.`)
  const rows = Number(response.headers.get('X-Tile-Rows'))
  const buffer = await response.arrayBuffer()
  return {
    rows,
    samples: image.sampleBits === 16 ? new Uint16Array(buffer) : new Uint8Array(buffer),
  }
}

export const fitPoints = (
  projectId: IdParam,
  holeId: IdParam,
  imageId: IdParam,
  points: TracePoint[],
) => api.post<FitResult>(`${imagesPath(projectId, holeId)}/${seg(imageId)}/fit`, { points })

export const listImagePicks = (projectId: IdParam, holeId: IdParam, imageId: IdParam) =>
  api.get<ImagePickRecord[]>(`${imagesPath(projectId, holeId)}/${seg(imageId)}/picks`)

export const createImagePick = (
  projectId: IdParam,
  holeId: IdParam,
  imageId: IdParam,
  body: {
    points: TracePoint[]
    type: string
    confidence?: string
    comment?: string
    suggested?: boolean
  },
  idempotencyKey?: string,
) =>
  api.post<ImagePickRecord>(`${imagesPath(projectId, holeId)}/${seg(imageId)}/picks`, body, {
    idempotencyKey,
  })

export const updateImagePick = (
  projectId: IdParam,
  holeId: IdParam,
  imageId: IdParam,
  structureId: IdParam,
  body: {
    points?: TracePoint[]
    type?: string
    confidence?: string | null
    comment?: string
    version: number
  },
) =>
  api.patch<ImagePickRecord>(
    `${imagesPath(projectId, holeId)}/${seg(imageId)}/picks/${seg(structureId)}`,
    body,
  )

export const deleteImagePick = (
  projectId: IdParam,
  holeId: IdParam,
  imageId: IdParam,
  structureId: IdParam,
  version: number,
) =>
  api.delete<void>(
    `${imagesPath(projectId, holeId)}/${seg(imageId)}/picks/${seg(structureId)}?version=${version}`,
  )

export const suggestSinusoids = (
  projectId: IdParam,
  holeId: IdParam,
  imageId: IdParam,
  from: number,
  to: number,
) =>
  api.get<Suggestion[]>(
    `${imagesPath(projectId, holeId)}/${seg(imageId)}/suggestions?from=${from}&to=${to}`,
  )
