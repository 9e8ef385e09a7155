import { and, asc, eq } from 'drizzle-orm'
import {
  coreRuns,
  domains,
  intervals,
  holes,
  memberships,
  projects,
  seedSteps,
  structures,
  surveyStations,
  users,
} from '../../../schema/index'
import { recomputeStructures } from '../services/structures'
import { demoDomains, demoFace, demoLogging } from './demo-logging'
import { replaceWithClusters } from '../services/sets'
import { hashPassword } from '../auth/passport'
import { stationRow } from '../services/survey'
import { declinationFor } from '../services/declination'
import type { Db, Executor, Tx } from './client'
import { demoLasFile, demoPicks } from './demo-logs'
import { seedDemoImage } from './demo-images'
import { commitLasImport, previewLasImport } from '../services/logs'
import { DEMO_PASSWORD, demoHoles, demoProject, demoUsers, type DemoHole } from './demo-data'
import { demoRandom } from './random'
import type { StructureInputRow } from './structure-columns'

/**
 * Seeds the demo idempotently: rows that exist (by e-mail, project code, hole name) are left as
 * they are, so a second run duplicates nothing and keeps what people changed.
 */
export async function seedDemo(db: Db): Promise<void> {
  const passwordHash = await hashPassword(DEMO_PASSWORD)
  await db.transaction(async (tx) => {
    await tx
      .insert(users)
      .values(
        demoUsers.map((u) => ({ email: u.email, name: u.name, isAdmin: u.isAdmin, passwordHash })),
      )
      .onConflictDoNothing({ target: users.email })
    await tx.insert(projects).values(demoProject).onConflictDoNothing({ target: projects.code })
    const [project] = await tx.select().from(projects).where(eq(projects.code, demoProject.code))
    for (const u of demoUsers) {
      if (!u.role) continue
      const [user] = await tx.select({ id: users.id }).from(users).where(eq(users.email, u.email))
      await tx
        .insert(memberships)
        .values({ projectId: project.id, userId: user.id, role: u.role })
        .onConflictDoNothing()
    }
    for (const demo of demoHoles) {
      const inserted = await tx
        .insert(holes)
        .values({
          projectId: project.id,
          name: demo.name,
          collarEast: demo.collarEast,
          collarNorth: demo.collarNorth,
          collarElevation: demo.collarElevation,
          plannedAzimuth: demo.plannedAzimuth,
          plannedPlunge: demo.plannedPlunge,
          finalDepth: demo.finalDepth,
          coreSize: 'HQ3',
          startDate: demo.startDate,
          status: 'complete',
        })
        .onConflictDoNothing()
        .returning()
      // Only a hole created now gets its demo survey: an existing hole keeps its own.
      if (inserted.length === 1) await seedSurvey(tx, project, inserted[0], demo)
      await once(tx, `demo:${demo.name}:logging`, () => seedLogging(tx, project, demo))
      if (demoLogHoles.includes(demo.name)) {
        await once(tx, `demo:${demo.name}:picks`, () => seedPicks(tx, project, demo))
      }
      await once(tx, `demo:${demo.name}:intervals`, () => seedIntervals(tx, project, demo))
    }
  })
  for (const name of demoLogHoles) await once(db, `demo:${name}:las`, () => seedLas(db, name))
  // the televiewer image and its marker in one transaction: a crash leaves neither
  for (const name of demoLogHoles) {
    await db.transaction((tx) =>
      once(tx, `demo:${name}:televiewer`, async () => {
        const found = await demoHoleRow(tx, name)
        if (!found) return
        const [admin] = await tx.select().from(users).where(eq(users.email, demoUsers[0].email))
        await seedDemoImage(tx, found.hole, admin?.id ?? null)
      }),
    )
  }
}

/** Holes of the demo that were also logged with a televiewer and geophysical tools. */
const demoLogHoles = ['GSQ-BH02', 'GSQ-BH05']

async function demoHoleRow(tx: Executor, name: string) {
  const [row] = await tx
    .select({ hole: holes, project: projects })
    .from(holes)
    .innerJoin(projects, eq(projects.id, holes.projectId))
    .where(and(eq(projects.code, demoProject.code), eq(holes.name, name)))
  if (!row) return undefined
  const stations = await tx
    .select()
    .from(surveyStations)
    .where(eq(surveyStations.holeId, row.hole.id))
    .orderBy(asc(surveyStations.depth))
  return { ...row, stations }
}

/** Image picks seen again from the hole's own oriented core structures, recomputed like any pick. */
async function seedPicks(tx: Tx, project: typeof projects.$inferSelect, demo: DemoHole) {
  const found = await demoHoleRow(tx, demo.name)
  if (!found || found.stations.length === 0) return
  const { structures: core } = demoLogging(demo.name, found.hole.finalDepth, found.stations)
  // a structure near the bottom seen deeper on the log would lie past the hole's end: left out
  const picks = demoPicks(demo.name, core).filter((p) => p.depth < found.hole.finalDepth)
  for (let i = 0; i < picks.length; i += 500) {
    await tx.insert(structures).values(
      picks.slice(i, i + 500).map((p): StructureInputRow => ({
        holeId: found.hole.id,
        depth: p.depth,
        type: p.type,
        source: 'image' as const,
        pickAmplitude: p.amplitude,
        pickDiameter: p.diameter,
        pickTroughAzimuth: p.troughAzimuth,
        pickReference: 'highside',
        pickAzimuthReference: 'highside',
        pickQuality: p.quality,
      })),
    )
  }
  await recomputeStructures(tx, project, found.hole)
}

/** A LAS file through the same reader and commit as an upload, kept as the import's original. */
async function seedLas(db: Db, name: string) {
  const found = await demoHoleRow(db, name)
  if (!found || found.stations.length === 0) return
  const [admin] = await db.select().from(users).where(eq(users.email, demoUsers[0].email))
  const text = demoLasFile(name, found.hole.finalDepth, found.stations)
  const preview = await previewLasImport(db, admin.id, found.project, found.hole, {
    fileName: `${name.toLowerCase()}-logs.las`,
    bytes: Buffer.from(text),
  })
  await commitLasImport(db, admin.id, found.project, found.hole, preview.importId, {
    depthShift: 0,
  })
}

/** Runs `step` unless a seed step of that name was applied before (even if its rows were edited since). */
async function once(tx: Executor, name: string, step: () => Promise<void>) {
  const [done] = await tx.select().from(seedSteps).where(eq(seedSteps.name, name))
  if (done) return
  await step()
  await tx.insert(seedSteps).values({ name })
}

/** Core runs and structures for a demo hole, computed with its survey like any logged structure. */
async function seedLogging(tx: Tx, project: typeof projects.$inferSelect, demo: DemoHole) {
  const [hole] = await tx
    .select()
    .from(holes)
    .where(and(eq(holes.projectId, project.id), eq(holes.name, demo.name)))
  if (!hole) return
  const stations = await tx
    .select()
    .from(surveyStations)
    .where(eq(surveyStations.holeId, hole.id))
    .orderBy(asc(surveyStations.depth))
  if (stations.length === 0) return
  const { runs, structures: items } = demoLogging(demo.name, hole.finalDepth, stations)
  await tx.insert(coreRuns).values(runs.map((r) => ({ ...r, holeId: hole.id })))
  for (let i = 0; i < items.length; i += 500) {
    await tx.insert(structures).values(
      items.slice(i, i + 500).map(({ dip: _d, dipDirection: _dd, ...s }): StructureInputRow => ({
        ...s,
        holeId: hole.id,
      })),
    )
  }
  await recomputeStructures(tx, project, hole)
}

async function seedSurvey(
  tx: Tx,
  project: typeof projects.$inferSelect,
  hole: typeof holes.$inferSelect,
  demo: DemoHole,
) {
  const random = demoRandom(demo.name)
  const stations = []
  for (let depth = 0; depth <= demo.finalDepth; depth += 30) {
    const trueAzimuth = demo.plannedAzimuth + demo.azimuthDrift * depth + (random() - 0.5) * 0.6
    const plunge = Math.min(
      89.5,
      demo.plannedPlunge + demo.plungeDrift * depth + (random() - 0.5) * 0.4,
    )
    stations.push({ depth, trueAzimuth, plunge: Math.round(plunge * 100) / 100 })
  }
  const method = demo.surveyReference === 'magnetic' ? 'multishot magnetic' : 'gyro'
  const declination =
    demo.surveyReference === 'magnetic'
      ? declinationFor(project, hole, new Date(demo.startDate))
      : 0
  // A magnetic tool reads true − declination: enter that, and let the server correct it back.
  const rows = stations.map((s) => ({
    ...stationRow(project, hole, {
      depth: s.depth,
      azimuth: Math.round(((((s.trueAzimuth - declination) % 360) + 360) % 360) * 100) / 100,
      plunge: s.plunge,
      azimuthReference: demo.surveyReference,
      method,
      surveyedOn: demo.startDate,
    }),
    holeId: hole.id,
  }))
  await tx.insert(surveyStations).values(rows)
  await tx
    .update(holes)
    .set({ surveyRevision: 1 })
    .where(and(eq(holes.id, hole.id), eq(holes.projectId, project.id)))
}

/** Intervals per demo domain with the design face, friction and sets found by clustering. */
async function seedIntervals(tx: Tx, project: typeof projects.$inferSelect, demo: DemoHole) {
  const [hole] = await tx
    .select()
    .from(holes)
    .where(and(eq(holes.projectId, project.id), eq(holes.name, demo.name)))
  if (!hole) return
  for (const domain of demoDomains) {
    // Transition zones 5 m either side of each domain boundary stay unassigned (left for review).
    const from = domain.from + 5
    const to = Math.min(domain.to, hole.finalDepth) - 5
    if (to - from < 10) continue
    await tx
      .insert(domains)
      .values({ projectId: project.id, name: domain.name })
      .onConflictDoNothing()
    const [d] = await tx
      .select()
      .from(domains)
      .where(and(eq(domains.projectId, project.id), eq(domains.name, domain.name)))
    const [interval] = await tx
      .insert(intervals)
      .values({
        holeId: hole.id,
        domainId: d.id,
        name: `${demo.name.slice(-4)} ${domain.name.toLowerCase()}`,
        fromDepth: from,
        toDepth: to,
        ...demoFace,
      })
      .returning()
    await replaceWithClusters(tx, interval, domain.sets.length)
  }
}
