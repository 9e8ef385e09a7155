import sharp from 'sharp'
import { createHash } from 'node:crypto'
import { and, asc, eq, isNull } from 'drizzle-orm'
import { renderWallRows, type PlantedTrace, type SynthOptions } from '../../../orient/index'
import { imagePicks, images, structures, type Hole } from '../../../schema/index'
import type { Tx } from './client'
import { demoRandom, seedOf } from './random'
import { TILE_ROWS, writeFileChunks, writePyramid } from '../imports/images/index'
import { demoImageBeta, demoImageOffset } from './demo-logs'

/**
 * The demo's televiewer: an acoustic amplitude image of the hole wall, high-side referenced on a
 * 96 mm hole, 4 mm a row and 144 samples a turn, rendered by orient's synthetic wall renderer with
 * every image pick the seed made drawn as its sinusoid (textured, noisy, seeded), so the picks sit
 * on visible traces — and the oriented core structures the seed did not pick drawn too, as much
 * deeper as the picks are (demo-logs.ts demoImageOffset), left for the interpreter and the suggestions
 * to find. Invented data: no real log.
 */
const ROW_STEP = 0.004
const WIDTH = 144
const DIAMETER_MM = 96

interface DemoPick {
  id: number
  depth: number
  pickAmplitude: number | null
  pickTroughAzimuth: number | null
}

/** Renders the image and stores it with its pyramid, the PNG as its file, and a raw pick per pick. */
export async function seedDemoImage(tx: Tx, hole: Hole, adminId: number | null): Promise<void> {
  const picks: DemoPick[] = await tx
    .select({
      id: structures.id,
      depth: structures.depth,
      pickAmplitude: structures.pickAmplitude,
      pickTroughAzimuth: structures.pickTroughAzimuth,
    })
    .from(structures)
    .leftJoin(imagePicks, eq(imagePicks.structureId, structures.id))
    // the seed's own picks only: any picked on an image since has its raw pick already
    .where(
      and(
        eq(structures.holeId, hole.id),
        eq(structures.source, 'image'),
        isNull(imagePicks.structureId),
      ),
    )
    .orderBy(asc(structures.depth))
  const usable = picks.filter((p) => p.pickAmplitude !== null && p.pickTroughAzimuth !== null)
  if (usable.length === 0) return
  const core = await tx
    .select({ depth: structures.depth, alpha: structures.alpha, beta: structures.beta })
    .from(structures)
    .where(and(eq(structures.holeId, hole.id), eq(structures.source, 'core')))
  const offset = demoImageOffset(hole.name).depth
  const unpicked = core.filter(
    (c) =>
      c.alpha !== null &&
      c.beta !== null &&
      c.alpha > 10 &&
      !usable.some((p) => Math.abs(p.depth - c.depth - offset) < 0.05),
  )
  const final = hole.finalDepth ?? usable.at(-1)!.depth + 2
  const top = Math.max(0, Math.floor(usable[0].depth - 2))
  const bottom = Math.min(final, Math.ceil(usable.at(-1)!.depth + 2))
  const rows = Math.round((bottom - top) / ROW_STEP)
  const random = demoRandom(`${hole.name}:televiewer`)
  const traces: PlantedTrace[] = usable.map((p) => ({
    depth: p.depth,
    height: p.pickAmplitude! / 1000,
    troughAzimuth: p.pickTroughAzimuth!,
    contrast: 0.35 + random() * 0.4,
    thickness: 0.005 + random() * 0.008,
    gaps: random() < 0.3 ? random() * 0.35 : 0,
  }))
  for (const c of unpicked) {
    const depth = c.depth + offset
    if (depth < top + 0.3 || depth > bottom - 0.3) continue
    traces.push({
      depth,
      // H = D·tan(90° − alpha), trough = beta + 180 (demo-logs.ts demoPicks)
      height: (DIAMETER_MM * Math.tan(((90 - c.alpha!) * Math.PI) / 180)) / 1000,
      troughAzimuth: (demoImageBeta(hole.name, c.depth, c.beta!) + 180) % 360,
      contrast: 0.3 + random() * 0.35,
      thickness: 0.005 + random() * 0.006,
      gaps: random() < 0.4 ? random() * 0.4 : 0,
    })
  }
  const options: SynthOptions = {
    width: WIDTH,
    rows,
    topDepth: top,
    rowStep: ROW_STEP,
    traces,
    seed: seedOf(`${hole.name}:wall`),
  }
  const samples = new Uint8Array(rows * WIDTH)
  for (let from = 0; from < rows; from += 4096) {
    const to = Math.min(rows, from + 4096)
    const grey = renderWallRows(options, from, to)
    for (let i = 0; i < grey.length; i++)
      samples[from * WIDTH + i] = Math.round(Math.min(1, Math.max(0, grey[i])) * 255)
  }
  const png = await sharp(samples, { raw: { width: WIDTH, height: rows, channels: 1 } })
    .toColourspace('b-w')
    .png({ compressionLevel: 6 })
    .toBuffer()
  const fileName = `${hole.name.toLowerCase()}-acoustic-amplitude.png`
  const [image] = await tx
    .insert(images)
    .values({
      holeId: hole.id,
      kind: 'amplitude',
      source: 'raster',
      name: `${hole.name} acoustic amplitude`,
      fileName,
      mediaType: 'image/png',
      fileSize: png.length,
      sha256: createHash('sha256').update(png).digest('hex'),
      topDepth: top,
      bottomDepth: top + rows * ROW_STEP,
      width: WIDTH,
      height: rows,
      channels: 1,
      sampleBits: 8,
      leftAzimuth: 0,
      azimuthReference: 'highside',
      northReference: null,
      diameterMm: DIAMETER_MM,
      diameterSource: 'entered',
      tileRows: TILE_ROWS,
      status: 'processing',
      notes: ['Demo image: rendered from the hole’s own picks (invented data).'],
      createdBy: adminId,
    })
    .returning({ id: images.id })
  await writeFileChunks(tx, image.id, png)
  const levels = await writePyramid(
    tx,
    image.id,
    { width: WIDTH, rows, channels: 1, samples, zeroIsNoValue: false },
    TILE_ROWS,
  )
  await tx
    .update(images)
    .set({ status: 'ready', progress: 100, levels })
    .where(eq(images.id, image.id))
  // each pick's raw record: eight points on its trace, as if clicked
  for (let i = 0; i < usable.length; i += 500) {
    await tx.insert(imagePicks).values(
      usable.slice(i, i + 500).map((p) => {
        const half = p.pickAmplitude! / 2000
        const points = [0, 45, 90, 135, 180, 225, 270, 315].map((azimuth) => ({
          depth: p.depth + half * Math.cos(((azimuth - p.pickTroughAzimuth!) * Math.PI) / 180),
          azimuth,
        }))
        return {
          structureId: p.id,
          imageId: image.id,
          points,
          centreDepth: p.depth,
          heightMm: p.pickAmplitude!,
          troughAzimuth: p.pickTroughAzimuth!,
          diameterMm: DIAMETER_MM,
          azimuthReference: 'highside' as const,
          rmsMm: 0,
        }
      }),
    )
  }
}
