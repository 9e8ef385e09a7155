import {
  computeStructures,
  fitSinusoid,
  prepareSurvey,
  referNorth,
  storedInputs,
  type ComputeContext,
  type SinusoidFit,
  type StoredStructure,
  type StructureFlag,
  type TracePoint,
} from '../../../orient/index'
import type { Hole, Image, Project } from '../../../schema/index'
import type { Executor } from '../db/client'
import type { StructureInputRow } from '../db/structure-columns'
import { badRequest, conflict } from '../http/errors'
import { declinationFor } from './declination'
import { loadComputeContext } from './structure-context'

/** A sinusoid as picked on an image: centre depth (m), height (mm), trough in the image's reference. */
export interface RawSinusoid {
  depth: number
  heightMm: number
  troughAzimuth: number
}

/** What converting sinusoids of one image needs: the hole's compute context and the declination. */
export interface ImageConversion {
  ctx: ComputeContext
  image: Pick<Image, 'azimuthReference' | 'northReference' | 'diameterMm' | 'depthShiftApplied'>
  hole: Hole
  /** Degrees east, for magnetic-north images (0 otherwise). */
  declination: number
  holeAt: (depth: number) => { trend: number; plunge: number }
}

/** The image's pick columns and computed plane of one sinusoid, as storing it would give. */
export interface Converted {
  inputs: StoredStructure & StructureInputRow
  dip: number | null
  dipDirection: number | null
  flags: StructureFlag[]
}

/** 409 unless the image's pyramid is stored: nothing can be picked on it before. */
export function assertReady(image: Pick<Image, 'status'>): void {
  if (image.status !== 'ready')
    throw conflict(
      image.status === 'processing'
        ? 'The image is still being processed: pick on it once it is ready.'
        : 'The image could not be read: upload it again.',
      'image_not_ready',
    )
}

/**
 * The hole's compute context with the declination of a magnetic-north image: the project's
 * declination at the collar on the hole's start date, as imported picks get it (services/picks.ts).
 */
export async function imageConversion(
  db: Executor,
  project: Project,
  hole: Hole,
  image: ImageConversion['image'],
): Promise<ImageConversion> {
  const ctx = await loadComputeContext(db, project, hole)
  const survey = prepareSurvey(ctx.stations)
  const magnetic = image.azimuthReference === 'north' && image.northReference === 'magnetic'
  const declination = magnetic
    ? declinationFor(project, hole, hole.startDate ? new Date(hole.startDate) : new Date())
    : 0
  return { ctx, image, hole, declination, holeAt: (d) => survey.holeAt(d) ?? ctx.planned }
}

/**
 * A sinusoid as a structure: the pick columns (trough referred to true north for a magnetic-north
 * image, in the hole's frame at the pick's depth) and the plane computeStructures gives them — the
 * same function the recompute runs on the stored row, so a fit answers what storing it would store.
 */
export function convertSinusoid(conv: ImageConversion, s: RawSinusoid, type: string): Converted {
  const { image } = conv
  const north = image.azimuthReference === 'north'
  const trough =
    conv.declination !== 0
      ? (referNorth(s.troughAzimuth, conv.holeAt(s.depth), conv.declination) ?? s.troughAzimuth)
      : s.troughAzimuth
  const inputs = {
    holeId: conv.hole.id,
    depth: s.depth,
    type: type as StructureInputRow['type'],
    source: 'image' as const,
    alpha: null,
    beta: null,
    referenceLine: null,
    inputDip: null,
    inputDipDirection: null,
    pickAmplitude: s.heightMm,
    pickDiameter: image.diameterMm,
    pickTroughAzimuth: trough,
    pickReference: north ? 'north' : 'highside',
    // Picked on an image moved onto core depths: the logged depth is this + the shift.
    depthShiftApplied: image.depthShiftApplied,
    pickAzimuthReference: north ? `north-${image.northReference ?? 'true'}` : 'highside',
  }
  const [computed] = computeStructures(conv.ctx, [storedInputs(inputs)])
  return { inputs, dip: computed.dip, dipDirection: computed.dipDirection, flags: computed.flags }
}

/**
 * The least-squares sinusoid through points clicked on the image; 400 naming `points` when one
 * lies outside the image's depths or they do not fix a sinusoid (three distinct azimuths at least).
 */
export function fitOnImage(
  image: Pick<Image, 'topDepth' | 'bottomDepth'>,
  points: readonly TracePoint[],
  path = 'body.points',
): { fit: SinusoidFit; raw: RawSinusoid; rmsMm: number } {
  const range = `${image.topDepth}–${image.bottomDepth} m`
  const outside = points.flatMap((p, i) =>
    p.depth < image.topDepth || p.depth > image.bottomDepth
      ? [{ path: `${path}.${i}.depth`, message: `outside the image (${range})` }]
      : [],
  )
  if (outside.length > 0)
    throw badRequest(`Every point must lie on the image (${range}).`, outside.slice(0, 50))
  const fit = fitSinusoid(points)
  if (!fit)
    throw badRequest('These points do not fix a sinusoid.', [
      { path, message: 'give points at three or more different azimuths' },
    ])
  return {
    fit,
    raw: { depth: fit.depth, heightMm: fit.height * 1000, troughAzimuth: fit.troughAzimuth },
    rmsMm: fit.rms * 1000,
  }
}

export interface FitAnswer {
  depth: number
  height: number
  troughAzimuth: number
  rmsMm: number
  dip: number | null
  dipDirection: number | null
}

/** Any type will do for a preview: the type changes no computed value of an image pick. */
export const PREVIEW_TYPE = 'joint'

/**
 * The sinusoid through the points and the true plane storing it would give (same survey, grid
 * convergence, declination and conversion as the stored structure); nothing is stored.
 */
export async function fitImagePoints(
  db: Executor,
  project: Project,
  hole: Hole,
  image: Image,
  points: readonly TracePoint[],
): Promise<FitAnswer> {
  assertReady(image)
  const { raw, rmsMm } = fitOnImage(image, points)
  const converted = convertSinusoid(
    await imageConversion(db, project, hole, image),
    raw,
    PREVIEW_TYPE,
  )
  return {
    depth: raw.depth,
    height: raw.heightMm,
    troughAzimuth: raw.troughAzimuth,
    rmsMm,
    dip: converted.dip,
    dipDirection: converted.dipDirection,
  }
}
