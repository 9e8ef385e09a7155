import { eq, sql } from 'drizzle-orm'
import type pg from 'pg'
import { coreRuns, imports, structures, type Hole, type Project } from '../../../schema/index'
import type { Db, Executor } from '../db/client'
import type { Analysis } from '../imports/analyse'
import { copyStructures } from '../imports/copy-structures'
import type { PickImportOptionsT } from '../imports/kinds/picks'
import { computeStructures } from '../../../orient/index'
import { insertPicks, picksToStructures } from './picks'
import { loadComputeContext } from './structure-context'
import { recomputeStructures } from './structures'
import { replaceRunsIn } from './runs'
import { listStations, replaceSurveyIn } from './survey'
import { computeInput } from './imports'
import type { ReplacedRows } from './import-guards'

export interface ApplyTarget {
  db: Db
  tx: Executor
  client: pg.PoolClient
  project: Project
  hole: Hole
  importId: string
  userId: number
}

/**
 * Writes an analysed import's rows inside the open transaction: structures by COPY, picks in
 * chunks, runs and survey by replacement. A replacement returns what it took out and the ids it
 * wrote, so that undoing the import can put the hole back as it was.
 */
export async function applyImport(t: ApplyTarget, a: Analysis): Promise<ReplacedRows | undefined> {
  const { tx, project, hole, userId } = t
  if (a.kind === 'structures') {
    const [existing] = await tx
      .select({ n: sql<number>`count(*)::int` })
      .from(structures)
      .where(eq(structures.holeId, hole.id))
    const ctx = await loadComputeContext(tx, project, hole)
    const inputs = (a as Analysis<'structures'>).rows
      .map((r) => r.value)
      .sort((x, y) => x.depth - y.depth)
    const computed = computeStructures(ctx, inputs.map(computeInput))
    const progress = (done: number) =>
      t.db
        .update(imports)
        .set({ progress: Math.round((90 * done) / inputs.length) })
        .where(eq(imports.id, t.importId))
        .then(() => undefined)
    await copyStructures(
      t.client,
      { holeId: hole.id, surveyRevision: hole.surveyRevision, importId: t.importId, userId },
      inputs,
      computed,
      progress,
    )
    // Beta jumps and run flags depend on neighbours: with earlier structures, recompute the hole.
    if (existing.n > 0) await recomputeStructures(tx, project, hole)
    return undefined
  }
  if (a.kind === 'picks') {
    const ctx = await loadComputeContext(tx, project, hole)
    const rows = picksToStructures(
      ctx,
      project,
      hole,
      (a as Analysis<'picks'>).rows.map((r) => r.value),
      a.options as PickImportOptionsT,
    )
    await insertPicks(tx, rows, t.importId, userId)
    await recomputeStructures(tx, project, hole)
    return undefined
  }
  if (a.kind === 'runs') {
    const before = await tx.select().from(coreRuns).where(eq(coreRuns.holeId, hole.id))
    const values = (a as Analysis<'runs'>).rows.map((r) => r.value)
    await replaceRunsIn(tx, userId, project, hole, values)
    // Every run of the hole is now this import's: mark them so the history can tell.
    const written = await tx
      .update(coreRuns)
      .set({ importId: t.importId })
      .where(eq(coreRuns.holeId, hole.id))
      .returning({ id: coreRuns.id })
    return { kind: 'runs', rows: before, insertedIds: written.map((r) => r.id) }
  }
  const before = await listStations(tx, hole.id)
  const stations = (a as Analysis<'survey'>).rows.map((r) => r.value)
  const after = await replaceSurveyIn(tx, userId, project, hole, stations)
  return { kind: 'survey', rows: before, insertedIds: after.map((s) => s.id) }
}
