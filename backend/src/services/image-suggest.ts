import { eq } from 'drizzle-orm'
import {
  angleBetweenPlanes,
  detectSinusoids,
  imagePickToPlane,
  type Plane,
} from '../../../orient/index'
import { imagePicks, type Hole, type Image, type Project } from '../../../schema/index'
import type { Executor } from '../db/client'
import { badRequest } from '../http/errors'
import { readRows } from './image-rows'
import {
  assertReady,
  convertSinusoid,
  imageConversion,
  PREVIEW_TYPE,
  type RawSinusoid,
} from './image-pick-geometry'

export interface SuggestionAnswer {
  depth: number
  /** Peak to trough (mm). */
  height: number
  /** In the image's reference. */
  troughAzimuth: number
  dip: number | null
  dipDirection: number | null
  score: number
}

/** The detector works best at about 1–3 mm a row; finer levels only cost time. */
const FINEST_ROW_M = 0.001
/** At most this many samples go to the detector at once (a 20 m window of a fine image). */
const MAX_SAMPLES = 3_000_000
/** Taller traces (relative dip above this) are not offered: they are flagged when picked anyway. */
const MAX_RELATIVE_DIP = 80
const MAX_SUGGESTIONS = 50
/** A candidate this close to an existing pick of the image is that pick found again. */
const SAME_POLE_DEG = 3
const SAME_DEPTH_M = 0.05
/** Image azimuths as a plane in one fixed frame, so two sinusoids of one image compare. */
const IMAGE_FRAME = { trend: 0, plunge: 90 }

const rowStepOf = (image: Image) => (image.bottomDepth - image.topDepth) / image.height

/** The coarsest level still about 1 mm a row or finer, coarser again while over the sample cap. */
export function suggestionLevel(image: Image, spanM: number): number {
  const step = (level: number) => rowStepOf(image) * 2 ** level
  let level = 0
  while (level + 1 < image.levels && step(level) < FINEST_ROW_M) level++
  while (level + 1 < image.levels && (spanM / step(level)) * image.width > MAX_SAMPLES) level++
  return level
}

/**
 * The pick a sinusoid would be, relative to the hole (image frame): the angle between two such
 * planes is the angle between their true poles, both being turned by the same hole axis.
 */
const relativePlane = (
  s: Pick<RawSinusoid, 'heightMm' | 'troughAzimuth'>,
  diameterMm: number,
): Plane | undefined =>
  imagePickToPlane(
    {
      amplitude: s.heightMm,
      diameter: diameterMm,
      troughAzimuth: s.troughAzimuth,
      reference: 'highside',
    },
    IMAGE_FRAME,
  )

/**
 * Sinusoids the detector finds with centres in [from, to] (clamped to the image), converted as a
 * pick would be, best first; those within 3° and 0.05 m of a pick already made on this image are
 * left out. Rows half a tall trace beyond the window are read so traces across its edges count.
 * Nothing is stored: the interpreter accepts one by posting it as a pick.
 */
export async function suggestSinusoids(
  db: Executor,
  project: Project,
  hole: Hole,
  image: Image,
  window: { from: number; to: number },
): Promise<SuggestionAnswer[]> {
  assertReady(image)
  const from = Math.max(window.from, image.topDepth)
  const to = Math.min(window.to, image.bottomDepth)
  if (to <= from)
    throw badRequest('The window lies outside the image.', [
      {
        path: 'query.from',
        message: `outside the image (${image.topDepth}–${image.bottomDepth} m)`,
      },
    ])
  const margin = ((image.diameterMm / 1000) * Math.tan((MAX_RELATIVE_DIP * Math.PI) / 180)) / 2
  const level = suggestionLevel(image, to - from + 2 * margin)
  const step = rowStepOf(image) * 2 ** level
  const rowsAtLevel = Math.ceil(image.height / 2 ** level)
  const fromRow = Math.max(0, Math.floor((from - margin - image.topDepth) / step))
  const toRow = Math.min(rowsAtLevel, Math.ceil((to + margin - image.topDepth) / step))
  const grey = await readRows(db, image, level, fromRow, toRow)
  const found = detectSinusoids(
    {
      width: grey.width,
      rows: grey.rows,
      topDepth: image.topDepth + fromRow * step,
      rowStep: step,
      leftAzimuth: image.leftAzimuth,
      values: grey.values,
    },
    {
      diameter: image.diameterMm,
      maxRelativeDip: MAX_RELATIVE_DIP,
      maxCandidates: MAX_SUGGESTIONS,
    },
  )
  const picked = (await db.select().from(imagePicks).where(eq(imagePicks.imageId, image.id))).map(
    (p) => ({ depth: p.centreDepth, plane: relativePlane(p, p.diameterMm) }),
  )
  const conv = await imageConversion(db, project, hole, image)
  const out: SuggestionAnswer[] = []
  for (const c of found) {
    if (c.depth < from || c.depth > to) continue
    const raw = { depth: c.depth, heightMm: c.height * 1000, troughAzimuth: c.troughAzimuth }
    const plane = relativePlane(raw, image.diameterMm)
    const known = picked.some(
      (p) =>
        Math.abs(p.depth - raw.depth) <= SAME_DEPTH_M &&
        plane !== undefined &&
        p.plane !== undefined &&
        (angleBetweenPlanes(p.plane, plane) ?? 90) <= SAME_POLE_DEG,
    )
    if (known) continue
    const { dip, dipDirection } = convertSinusoid(conv, raw, PREVIEW_TYPE)
    out.push({
      depth: raw.depth,
      height: raw.heightMm,
      troughAzimuth: raw.troughAzimuth,
      dip,
      dipDirection,
      score: c.score,
    })
  }
  return out.sort((a, b) => b.score - a.score)
}
