// A hole logged twice over: 60 planes on oriented core and again on a high-side televiewer image,
// the image 0.35 m deeper and one run's betas logged 25° short (so +25° must be added), with
// Fisher noise on both sides (kappa 500 about each true pole, ≈ 2.6° rms angular error on each
// record: about what alpha ±2° and beta ±4° readings give). Five 6 m runs of 12 planes each.
// Invented data, seeded.
import { eq } from 'drizzle-orm'
import { coreRuns, holes, projects, structures, surveyStations } from '../../schema/index'
import { holeAt, planeOfPole, planeToCore, poleOf, type Plane } from '../../orient/index'
import { recomputeStructures } from '../../backend/src/services/structure-recompute'
import { fisherSample, seeded } from '../orient/sample'
import type { Fixture } from './fixture'

export const SHIFT = 0.35
export const TURN = 25
export const BAD_RUN = 2
const DIAMETER = 96
const SETS: Plane[] = [
  { dipDirection: 40, dip: 35 },
  { dipDirection: 160, dip: 70 },
  { dipDirection: 275, dip: 55 },
]

const noisy = (plane: Plane, random: () => number, kappa = 500): Plane =>
  planeOfPole(fisherSample(poleOf(plane)!, kappa, 1, random)[0])!

/** Stores survey, five 6 m runs from 10 m, 60 core structures and their 60 image partners. */
export async function seedReconciliationHole(fx: Fixture, seed = 7) {
  const random = seeded(seed)
  await fx.db.delete(structures).where(eq(structures.holeId, fx.holeId))
  await fx.db.delete(coreRuns).where(eq(coreRuns.holeId, fx.holeId))
  await fx.db.delete(surveyStations).where(eq(surveyStations.holeId, fx.holeId))
  const stations = [
    { depth: 0, azimuth: 120, plunge: 60 },
    { depth: 50, azimuth: 124, plunge: 58 },
  ]
  for (const st of stations)
    await fx.db
      .insert(surveyStations)
      .values({ holeId: fx.holeId, ...st, azimuthEntered: st.azimuth })
  const runs = await fx.db
    .insert(coreRuns)
    .values(
      Array.from({ length: 5 }, (_, k) => ({
        holeId: fx.holeId,
        fromDepth: 10 + 6 * k,
        toDepth: 16 + 6 * k,
        recovered: 5.8,
        solid: 4.5,
        rqdLength: 4,
      })),
    )
    .returning()
  const rows = []
  for (let i = 0; i < 60; i++) {
    const depth = Math.round((10.1 + i * (29.8 / 60) + random() * 0.05) * 1000) / 1000
    const plane = noisy(SETS[i % 3], random, 60)
    const hole = holeAt(stations, depth)!
    const core = planeToCore(noisy(plane, random), hole)!
    const run = Math.floor((depth - 10) / 6)
    rows.push({
      holeId: fx.holeId,
      depth,
      type: 'joint' as const,
      alpha: core.alpha,
      beta: (core.beta - (run === BAD_RUN ? TURN : 0) + 360) % 360,
    })
    // the image's own depth error: ±2 cm about the shifted depth
    const imageDepth = Math.round((depth + SHIFT + (random() - 0.5) * 0.04) * 1000) / 1000
    const seen = planeToCore(noisy(plane, random), holeAt(stations, imageDepth)!)!
    rows.push({
      holeId: fx.holeId,
      depth: imageDepth,
      type: 'joint' as const,
      source: 'image' as const,
      // high-side image: H = D·tan(90° − alpha), trough = beta + 180 (image-pick.ts)
      pickAmplitude: DIAMETER * Math.tan(((90 - seen.alpha) * Math.PI) / 180),
      pickDiameter: DIAMETER,
      pickTroughAzimuth: (seen.beta + 180) % 360,
      pickReference: 'highside',
    })
  }
  await fx.db.insert(structures).values(rows)
  const [project] = await fx.db.select().from(projects).where(eq(projects.id, fx.projectId))
  const [hole] = await fx.db.select().from(holes).where(eq(holes.id, fx.holeId))
  await recomputeStructures(fx.db, project, hole)
  return { runs, badRun: runs[BAD_RUN] }
}
