import { and, eq, inArray, sql } from 'drizzle-orm'
import { drizzle } from 'drizzle-orm/node-postgres'
import type pg from 'pg'
import * as schema from '../../../schema/index'
import {
  holes,
  imports,
  projects,
  structures,
  type Hole,
  type Import,
  type Project,
  type StructureInputT,
} from '../../../schema/index'
import type { Db } from '../db/client'
import { ApiError, conflict, notFound } from '../http/errors'
import { analyseCsv, type Analysis, type CsvImportKind } from '../imports/analyse'
import { rowErrorDetails } from '../imports/csv-rows'
import { copyStructures } from '../imports/copy-structures'
import { audit } from './audit'
import { computeStructures, storedInputs, type StructureComputed } from '../../../orient/index'
import { insertPicks, picksToStructures } from './picks'
import type { PickImportOptionsT } from '../imports/kinds/picks'
import { loadComputeContext } from './structure-context'
import { recomputeStructures } from './structures'
import { replaceRunsIn } from './runs'
import { replaceSurveyIn } from './survey'

/** Imports above this many rows commit as a background job; smaller ones within the request. */
export const BACKGROUND_ROWS = 5_000
const SAMPLE_ROWS = 20

interface StoredSettings {
  mapping: Record<string, string>
  options: Record<string, unknown>
}

function rowErrorsFail(a: Analysis): never {
  throw new ApiError(
    422,
    'row_errors',
    `${a.errors.length} row error${a.errors.length === 1 ? '' : 's'} in the file: nothing was imported.`,
    rowErrorDetails(a.errors),
    {
      headers: a.table.headers,
      mapping: a.mapping,
      options: a.options,
      rowCount: a.table.rows.length,
      errorCount: a.errors.length,
    },
  )
}

/** A structure as posted or imported → what computeStructures reads (a true orientation as input). */
const computeInput = (s: StructureInputT) => ({
  ...s,
  source: s.source ?? 'core',
  inputDip: s.dip,
  inputDipDirection: s.dipDirection,
})

/** How many rows carry each flag. */
function countFlags(computed: readonly StructureComputed[]) {
  const counts: Record<string, number> = {}
  for (const c of computed) for (const f of c.flags) counts[f] = (counts[f] ?? 0) + 1
  return counts
}

/** Structures of the preview with their computed orientation, and flag counts over all rows. */
async function structurePreview(db: Db, project: Project, hole: Hole, a: Analysis<'structures'>) {
  const ctx = await loadComputeContext(db, project, hole)
  const inputs = a.rows.map((r) => r.value)
  const order = inputs.map((_, i) => i).sort((x, y) => inputs[x].depth - inputs[y].depth)
  const computed = computeStructures(
    ctx,
    order.map((i) => computeInput(inputs[i])),
  )
  const flagCounts = countFlags(computed)
  const byRow = new Map(order.map((row, k) => [row, computed[k]]))
  const sample = a.rows
    .slice(0, SAMPLE_ROWS)
    .map((r, i) => ({ line: r.line, ...r.value, computed: byRow.get(i) }))
  return { sample, flagCounts }
}

/** Picks converted like at commit, with their computed planes and flag counts. */
async function pickPreview(db: Db, project: Project, hole: Hole, a: Analysis<'picks'>) {
  const ctx = await loadComputeContext(db, project, hole)
  const rows = picksToStructures(
    ctx,
    project,
    hole,
    a.rows.map((r) => r.value),
    a.options as PickImportOptionsT,
  )
  const computed = computeStructures(ctx, rows.map(storedInputs))
  const flagCounts = countFlags(computed)
  const sample = a.rows
    .slice(0, SAMPLE_ROWS)
    .map((r, i) => ({ line: r.line, ...r.value, computed: computed[i] }))
  return { sample, flagCounts }
}

/**
 * Upload → preview. The file is read and every row checked; any error → 422 listing rows and
 * columns, and nothing is stored. A clean file is kept (original bytes, mapping, options) for
 * commit by id.
 */
export async function createImport(
  db: Db,
  actorId: number,
  project: Project,
  hole: Hole,
  kind: CsvImportKind,
  file: { name: string; buffer: Buffer },
  mapping: Record<string, string> | undefined,
  options: unknown,
) {
  const a = analyseCsv(kind, file.buffer, mapping, options)
  if (a.errors.length) rowErrorsFail(a)
  const preview =
    kind === 'structures'
      ? await structurePreview(db, project, hole, a as Analysis<'structures'>)
      : kind === 'picks'
        ? await pickPreview(db, project, hole, a as Analysis<'picks'>)
        : {
            sample: a.rows.slice(0, SAMPLE_ROWS).map((r) => ({ line: r.line, ...r.value })),
            flagCounts: {},
          }
  const settings: StoredSettings = { mapping: a.mapping, options: a.options }
  const [row] = await db
    .insert(imports)
    .values({
      projectId: project.id,
      holeId: hole.id,
      kind,
      fileName: file.name,
      file: file.buffer,
      options: settings,
      rowCount: a.rows.length,
      createdBy: actorId,
    })
    .returning({ id: imports.id })
  return {
    importId: row.id,
    kind,
    fileName: file.name,
    headers: a.table.headers,
    mapping: a.mapping,
    options: a.options,
    rowCount: a.rows.length,
    background: a.rows.length > BACKGROUND_ROWS,
    ...preview,
  }
}

export const importView = (i: Import) => ({
  id: i.id,
  kind: i.kind,
  status: i.status,
  fileName: i.fileName,
  rowCount: i.rowCount,
  progress: i.progress,
  message: i.message,
  createdAt: i.createdAt,
  committedAt: i.committedAt,
})

export async function getImport(
  db: Db,
  projectId: number,
  holeId: number,
  id: string,
): Promise<Import> {
  const [row] = await db
    .select()
    .from(imports)
    .where(and(eq(imports.id, id), eq(imports.projectId, projectId), eq(imports.holeId, holeId)))
  if (!row) throw notFound('Import')
  return row
}

/** Moves an import from a waiting state to `committing`; only one caller can win. */
async function claim(db: Db, id: string, states: Import['status'][]): Promise<Import | undefined> {
  const [row] = await db
    .update(imports)
    .set({ status: 'committing', progress: 0, message: '' })
    .where(and(eq(imports.id, id), inArray(imports.status, states)))
    .returning()
  return row
}

/** Marks the import as waiting for a worker. */
export async function queueImport(db: Db, id: string): Promise<void> {
  const [row] = await db
    .update(imports)
    .set({ status: 'queued', message: 'waiting for a worker' })
    .where(and(eq(imports.id, id), eq(imports.status, 'previewed')))
    .returning({ id: imports.id })
  if (!row)
    throw conflict('This import is already committed or being committed.', 'import_not_pending')
}

/**
 * Commits a previewed (or queued) import in ONE transaction: structures by COPY, runs and survey
 * by replacement. Any failure rolls everything back; the import then reads `failed` with the
 * reason (from a job) or stays `previewed` (from a request, which sees the error itself).
 */
export async function commitImport(
  db: Db,
  pool: pg.Pool,
  id: string,
  opts: { fromJob: boolean; actorId: number },
) {
  const claimed = await claim(
    db,
    id,
    opts.fromJob ? ['queued', 'committing', 'failed'] : ['previewed'],
  )
  if (!claimed)
    throw conflict('This import is already committed or being committed.', 'import_not_pending')
  const client = await pool.connect()
  const tx = drizzle(client, { schema })
  try {
    await client.query('begin')
    const [project] = await tx.select().from(projects).where(eq(projects.id, claimed.projectId))
    const [hole] = await tx.select().from(holes).where(eq(holes.id, claimed.holeId!)).for('update')
    const settings = claimed.options as StoredSettings
    const a = analyseCsv(
      claimed.kind as CsvImportKind,
      claimed.file,
      settings.mapping,
      settings.options,
    )
    if (a.errors.length) rowErrorsFail(a)
    const userId = opts.actorId
    if (a.kind === 'structures') {
      const existing = await tx
        .select({ n: sql<number>`count(*)::int` })
        .from(structures)
        .where(eq(structures.holeId, hole.id))
      const ctx = await loadComputeContext(tx, project, hole)
      const inputs = (a as Analysis<'structures'>).rows
        .map((r) => r.value)
        .sort((x, y) => x.depth - y.depth)
      const computed = computeStructures(ctx, inputs.map(computeInput))
      const progress = (done: number) =>
        db
          .update(imports)
          .set({ progress: Math.round((90 * done) / inputs.length) })
          .where(eq(imports.id, id))
          .then(() => undefined)
      await copyStructures(
        client,
        { holeId: hole.id, surveyRevision: hole.surveyRevision, importId: id, userId },
        inputs,
        computed,
        progress,
      )
      // Beta jumps and run flags depend on neighbours: with earlier structures, recompute the hole.
      if (existing[0].n > 0) await recomputeStructures(tx, project, hole)
    } else if (a.kind === 'picks') {
      const ctx = await loadComputeContext(tx, project, hole)
      const rows = picksToStructures(
        ctx,
        project,
        hole,
        (a as Analysis<'picks'>).rows.map((r) => r.value),
        a.options as PickImportOptionsT,
      )
      await insertPicks(tx, rows, id, userId)
      await recomputeStructures(tx, project, hole)
    } else if (a.kind === 'runs') {
      await replaceRunsIn(
        tx,
        userId,
        project,
        hole,
        (a as Analysis<'runs'>).rows.map((r) => r.value),
      )
    } else {
      await replaceSurveyIn(
        tx,
        userId,
        project,
        hole,
        (a as Analysis<'survey'>).rows.map((r) => r.value),
      )
    }
    await tx
      .update(imports)
      .set({ status: 'committed', progress: 100, committedAt: new Date(), message: '' })
      .where(eq(imports.id, id))
    await audit(tx, {
      projectId: project.id,
      userId,
      entity: 'import',
      entityId: id,
      action: 'import',
      after: { kind: a.kind, fileName: claimed.fileName, rows: a.rows.length, ...settings },
    })
    await client.query('commit')
    return { status: 'committed' as const, rowCount: a.rows.length }
  } catch (err: unknown) {
    await client.query('rollback')
    const message = err instanceof Error ? err.message : String(err)
    await db
      .update(imports)
      .set(opts.fromJob ? { status: 'failed', message } : { status: 'previewed', message })
      .where(eq(imports.id, id))
    throw err
  } finally {
    client.release()
  }
}
