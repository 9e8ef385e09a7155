import { and, eq, sql } from 'drizzle-orm'
import {
  coreRuns,
  holes,
  imports,
  structures,
  surveyStations,
  type CoreRun,
  type Hole,
  type Import,
  type Interval,
  type Project,
  type SurveyStation,
} from '../../../schema/index'
import type { Db, Executor } from '../db/client'
import { ApiError, conflict, notFound } from '../http/errors'
import { audit } from './audit'
import { assertNotFrozen } from './freeze'
import {
  describeIntervals,
  intervalsReached,
  isFrozen,
  replacedOf,
  type ImportReach,
  type ReplacedRows,
} from './import-guards'
import { recomputeStructures } from './structures'
import { stationRow } from './survey'

/** Approved or issued → 409 via assertNotFrozen; checked → 409 too: undo never changes either. */
async function refuseReviewed(tx: Executor, hole: Hole, reach: ImportReach) {
  const reached = await intervalsReached(tx, hole.id, reach)
  const what = 'Undoing this import'
  await assertNotFrozen(
    tx,
    hole.id,
    { intervalIds: reached.filter(isFrozen).map((i) => i.id) },
    what,
  )
  const checked = reached.filter((i: Interval) => i.status === 'checked')
  if (checked.length === 0) return
  throw new ApiError(
    409,
    'interval_checked',
    `${what} would change the checked interval ${describeIntervals(checked)}: reopen it (back to draft) first.`,
    checked.map((i) => ({ path: 'interval', message: `${i.id} is checked` })),
    { intervalIds: checked.map((i) => i.id) },
  )
}

/** Structures or picks: the rows carrying the import's id go, unless a person edited one since. */
async function removeAdded(tx: Executor, project: Project, hole: Hole, imp: Import) {
  const rows = await tx
    .select({ id: structures.id, depth: structures.depth, version: structures.version })
    .from(structures)
    .where(and(eq(structures.importId, imp.id), eq(structures.holeId, hole.id)))
  const edited = rows.filter((r) => r.version > 1).length
  if (edited > 0) {
    throw conflict(
      `${edited} row${edited === 1 ? ' of this import was' : 's of this import were'} edited after the import: undoing it would lose those edits. Delete the rows one by one instead.`,
      'import_rows_edited',
    )
  }
  await refuseReviewed(tx, hole, { depths: rows.map((r) => r.depth) })
  await tx.delete(structures).where(eq(structures.importId, imp.id))
  const recomputed = await recomputeStructures(tx, project, hole)
  return { removed: rows.length, restored: 0, recomputed }
}

/** Runs or survey: the hole must still hold exactly what the import wrote (no later edit). */
async function putBack(tx: Executor, project: Project, hole: Hole, replaced: ReplacedRows) {
  const table = replaced.kind === 'runs' ? coreRuns : surveyStations
  const current = await tx
    .select({ id: table.id, version: table.version })
    .from(table)
    .where(eq(table.holeId, hole.id))
  const ids = new Set(replaced.insertedIds)
  const same = current.length === ids.size && current.every((r) => ids.has(r.id) && r.version === 1)
  if (!same) {
    const what = replaced.kind === 'runs' ? 'core runs' : 'survey'
    throw conflict(
      `The hole's ${what} changed after this import (edited, or replaced by a later import): undoing it would lose that change.`,
      'import_superseded',
    )
  }
  await refuseReviewed(tx, hole, { hole: true })
  await tx.delete(table).where(eq(table.holeId, hole.id))
  if (replaced.kind === 'runs') {
    const rows = replaced.rows as unknown as (CoreRun & { createdAt: string })[]
    if (rows.length)
      await tx
        .insert(coreRuns)
        .values(rows.map((r) => ({ ...r, holeId: hole.id, createdAt: new Date(r.createdAt) })))
    return { removed: current.length, restored: rows.length, hole }
  }
  // Stations go back as entered, corrected with today's declination and convergence settings.
  const rows = replaced.rows as unknown as SurveyStation[]
  if (rows.length)
    await tx.insert(surveyStations).values(
      rows.map((r) => ({
        ...stationRow(project, hole, {
          depth: r.depth,
          azimuth: r.azimuthEntered,
          plunge: r.plunge,
          azimuthReference: r.azimuthReference,
          method: r.method,
          surveyedOn: r.surveyedOn,
        }),
        id: r.id,
        holeId: hole.id,
        plungeConvention: r.plungeConvention,
        version: r.version,
      })),
    )
  const [bumped] = await tx
    .update(holes)
    .set({ surveyRevision: sql`${holes.surveyRevision} + 1` })
    .where(eq(holes.id, hole.id))
    .returning()
  return { removed: current.length, restored: rows.length, hole: bumped }
}

/**
 * Undoes a committed import in one transaction: the rows it added are removed (a replacing import
 * puts back the rows it took out), the hole's structures are recomputed, and the import reads
 * `undone` with who and when, audited with the counts. Refused (409) when the import is not
 * committed or already undone, when a reached interval is checked or approved, or when its rows
 * changed since.
 */
export async function undoImport(
  db: Db,
  actorId: number,
  project: Project,
  holeId: number,
  id: string,
) {
  return db.transaction(async (tx) => {
    const [hole] = await tx.select().from(holes).where(eq(holes.id, holeId)).for('update')
    const [imp] = await tx
      .select()
      .from(imports)
      .where(and(eq(imports.id, id), eq(imports.holeId, holeId), eq(imports.projectId, project.id)))
      .for('update')
    if (!hole || !imp) throw notFound('Import')
    if (imp.status === 'undone') throw conflict('This import was undone already.', 'import_undone')
    if (imp.status !== 'committed')
      throw conflict('Only a committed import can be undone.', 'import_not_committed')
    let counts: { removed: number; restored: number; recomputed: number }
    if (imp.kind === 'structures' || imp.kind === 'picks') {
      counts = await removeAdded(tx, project, hole, imp)
    } else {
      const replaced = imp.kind === 'las' ? undefined : replacedOf(imp)
      if (!replaced)
        throw conflict(
          'This import cannot be undone here: it kept no record of the rows it replaced.',
          'undo_not_supported',
        )
      const back = await putBack(tx, project, hole, replaced)
      const recomputed = await recomputeStructures(tx, project, back.hole)
      counts = { removed: back.removed, restored: back.restored, recomputed }
    }
    const [after] = await tx
      .update(imports)
      .set({ status: 'undone', undoneBy: actorId, undoneAt: new Date() })
      .where(eq(imports.id, id))
      .returning()
    await audit(tx, {
      projectId: project.id,
      userId: actorId,
      entity: 'import',
      entityId: id,
      action: 'undo',
      before: { status: imp.status, committedAt: imp.committedAt },
      after: { status: after.status, kind: imp.kind, fileName: imp.fileName, ...counts },
    })
    return { import: after, ...counts }
  })
}
