import { createHash } from 'node:crypto'
import { and, desc, eq } from 'drizzle-orm'
import {
  imports,
  type Hole,
  type Import,
  type Project,
  type StructureInputT,
} from '../../../schema/index'
import type { Db } from '../db/client'
import { ApiError, notFound } from '../http/errors'
import { analyseCsv, type Analysis, type CsvImportKind } from '../imports/analyse'
import { rowErrorDetails } from '../imports/csv-rows'
import { computeStructures, storedInputs, type StructureComputed } from '../../../orient/index'
import { picksToStructures } from './picks'
import type { PickImportOptionsT } from '../imports/kinds/picks'
import { loadComputeContext } from './structure-context'
import { duplicateOf, intervalsReached, reachOf, reachedView, replacedOf } from './import-guards'

/** Imports above this many rows commit as a background job; smaller ones within the request. */
export const BACKGROUND_ROWS = 5_000
const SAMPLE_ROWS = 20

export interface StoredSettings {
  mapping: Record<string, string>
  options: Record<string, unknown>
}

export function rowErrorsFail(a: Analysis): never {
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
export const computeInput = (s: StructureInputT) => ({
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
  const a = analyseCsv(kind, file.buffer, mapping, options, { finalDepth: hole.finalDepth })
  if (a.errors.length) rowErrorsFail(a)
  const sha256 = createHash('sha256').update(file.buffer).digest('hex')
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
      sha256,
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
    // e.g. "not UTF-8: read as Windows-1252": the preview must show it before anyone commits
    encoding: a.table.encoding,
    warnings: a.table.warnings,
    ...preview,
    // The same bytes already committed here: the UI warns, the commit needs a confirmation.
    duplicateOf: (await duplicateOf(db, { holeId: hole.id, kind, sha256 })) ?? null,
    // Approved ones refuse the commit; checked ones go back to draft when it goes through.
    intervalsReached: reachedView(await intervalsReached(db, hole.id, reachOf(a))),
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
  undoneAt: i.undoneAt,
  /** Rows a replacing import took out, which undoing it puts back. */
  replacedCount: replacedOf(i)?.rows.length ?? 0,
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

/** The hole's last 50 imports, newest first, as the history shows them. */
export async function listImports(db: Db, hole: Pick<Hole, 'id' | 'projectId'>) {
  const rows = await db
    .select()
    .from(imports)
    .where(and(eq(imports.holeId, hole.id), eq(imports.projectId, hole.projectId)))
    .orderBy(desc(imports.createdAt))
    .limit(50)
  return rows.map(importView)
}
