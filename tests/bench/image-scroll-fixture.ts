/**
 * The data the image-scroll bench draws: a project of its own (IMB) with one 320 m hole, 2,000
 * core structures, 300 image picks and a 300 m acoustic image (150,000 rows × 360, 2 mm rows)
 * rendered by orient's synthetic wall and tiled by the server's own pyramid code.
 */
import { eq } from 'drizzle-orm'
import type { Db } from '../../backend/src/db/client'
import { hashPassword } from '../../backend/src/auth/passport'
import { writePyramid } from '../../backend/src/imports/images/index'
import { mulberry32, renderWallRows } from '../../orient/index'
import {
  holes,
  imagePicks,
  images,
  memberships,
  projects,
  structures,
  surveyStations,
  users,
} from '../../schema/index'

export const BENCH_USER = { email: 'image-bench@bench.test', password: 'image-bench-password' }
export const IMAGE = { top: 10, bottom: 310, rows: 150_000, width: 360 }
const CODE = 'IMB'

/** Removes what an earlier run left (the project cascades to its hole, image and tiles). */
export async function dropBenchData(db: Db) {
  await db.delete(projects).where(eq(projects.code, CODE))
  await db.delete(users).where(eq(users.email, BENCH_USER.email))
}

export async function seedBenchHole(db: Db) {
  await dropBenchData(db)
  const random = mulberry32(20_251)
  const [user] = await db
    .insert(users)
    .values({
      email: BENCH_USER.email,
      name: 'Image bench',
      passwordHash: await hashPassword(BENCH_USER.password),
    })
    .returning()
  const [project] = await db
    .insert(projects)
    .values({ code: CODE, name: 'Image scroll bench', crsEpsg: 32630 })
    .returning()
  await db.insert(memberships).values({ projectId: project.id, userId: user.id, role: 'logger' })
  const [hole] = await db
    .insert(holes)
    .values({
      projectId: project.id,
      name: 'IMB-01',
      collarEast: 0,
      collarNorth: 0,
      collarElevation: 0,
      plannedAzimuth: 10,
      plannedPlunge: 60,
      finalDepth: 320,
    })
    .returning()
  await db.insert(surveyStations).values(
    Array.from({ length: 5 }, (_, i) => ({
      holeId: hole.id,
      depth: i * 80,
      azimuth: 10,
      azimuthEntered: 10,
      plunge: 60,
    })),
  )
  // Core structures spread down the hole (their orientation only matters to the other tracks).
  const core = Array.from({ length: 2000 }, (_, i) => {
    const dip = 10 + random() * 75
    const dipDirection = random() * 360
    return {
      holeId: hole.id,
      depth: (i + random()) * 0.16,
      type: 'joint' as const,
      source: 'true' as const,
      inputDip: dip,
      inputDipDirection: dipDirection,
      dip,
      dipDirection,
      poleTrend: (dipDirection + 180) % 360,
      polePlunge: 90 - dip,
      holeTrend: 10,
      holePlunge: 60,
    }
  })
  for (let i = 0; i < core.length; i += 500)
    await db.insert(structures).values(core.slice(i, i + 500))

  const rowStep = (IMAGE.bottom - IMAGE.top) / IMAGE.rows
  const traces = Array.from({ length: 300 }, (_, i) => ({
    depth: IMAGE.top + 0.5 + i * 0.99 + random() * 0.3,
    height: 0.02 + random() * 0.25,
    troughAzimuth: random() * 360,
  }))
  const samples = new Uint8Array(IMAGE.rows * IMAGE.width)
  const synth = {
    width: IMAGE.width,
    rows: IMAGE.rows,
    topDepth: IMAGE.top,
    rowStep,
    traces,
    seed: 7,
  }
  for (let r = 0; r < IMAGE.rows; r += 5000) {
    const grey = renderWallRows(synth, r, r + 5000)
    const base = r * IMAGE.width
    for (let i = 0; i < grey.length; i++)
      samples[base + i] = Math.max(0, Math.min(255, Math.round(grey[i] * 255)))
  }
  const [image] = await db
    .insert(images)
    .values({
      holeId: hole.id,
      kind: 'amplitude',
      source: 'raster',
      name: 'IMB-01 amplitude',
      fileName: 'imb-01-amplitude.png',
      mediaType: 'image/png',
      fileSize: samples.length,
      sha256: 'bench',
      topDepth: IMAGE.top,
      bottomDepth: IMAGE.bottom,
      width: IMAGE.width,
      height: IMAGE.rows,
      channels: 1,
      sampleBits: 8,
      azimuthReference: 'north',
      northReference: 'true',
      diameterMm: 96,
      diameterSource: 'entered',
      tileRows: 256,
      status: 'processing',
    })
    .returning()
  const levels = await writePyramid(
    db,
    image.id,
    { width: IMAGE.width, rows: IMAGE.rows, channels: 1, samples, zeroIsNoValue: false },
    256,
  )
  await db
    .update(images)
    .set({ levels, status: 'ready', progress: 100 })
    .where(eq(images.id, image.id))

  // The planted traces picked: image structures with their raw picks, drawn as sinusoids.
  const picked = await db
    .insert(structures)
    .values(
      traces.map((t) => ({
        holeId: hole.id,
        depth: t.depth,
        type: 'joint' as const,
        source: 'image' as const,
        pickAmplitude: t.height * 1000,
        pickDiameter: 96,
        pickTroughAzimuth: t.troughAzimuth,
        pickAzimuthReference: 'north',
        dip: 40,
        dipDirection: t.troughAzimuth,
        poleTrend: (t.troughAzimuth + 180) % 360,
        polePlunge: 50,
        holeTrend: 10,
        holePlunge: 60,
      })),
    )
    .returning({ id: structures.id })
  await db.insert(imagePicks).values(
    picked.map((s, i) => ({
      structureId: s.id,
      imageId: image.id,
      points: [],
      centreDepth: traces[i].depth,
      heightMm: traces[i].height * 1000,
      troughAzimuth: traces[i].troughAzimuth,
      diameterMm: 96,
      azimuthReference: 'north' as const,
      northReference: 'true' as const,
      rmsMm: 0.5,
    })),
  )
  return { project: project.id, hole: hole.id, image: image.id, levels }
}
