import { and, eq, sql } from 'drizzle-orm'
import { imports, logCurves, type Hole, type Project } from '../../../schema/index'
import type { Db, Executor } from '../db/client'
import { badRequest, conflict, notFound } from '../http/errors'
import {
  LasReadError,
  curvesToStore,
  STORED_DEPTH_RANGE,
  deviationSurvey,
  lasSummary,
  readLas,
  type LasFile,
} from '../imports/las/index'
import { audit } from './audit'

/** Reads the bytes or answers 400 naming each refused line as `file.line.N`. */
function readOrRefuse(bytes: Uint8Array): LasFile {
  try {
    return readLas(bytes)
  } catch (err: unknown) {
    if (!(err instanceof LasReadError)) throw err
    const details = err.issues.map((i) => ({ path: `file.line.${i.line}`, message: i.message }))
    throw badRequest(`The LAS file cannot be read: ${err.message}`, details, 'invalid_file')
  }
}

/** Hole names compare without case, spaces or punctuation: `GSQ BH02` matches `gsq-bh02`. */
const sameName = (a: string, b: string) => {
  const norm = (s: string) => s.toUpperCase().replace(/[^A-Z0-9]/g, '')
  return norm(a) !== '' && norm(a) === norm(b)
}

/** Reads an uploaded LAS file and keeps it as a previewed import; nothing else is written. */
export async function previewLasImport(
  db: Db,
  actorId: number,
  project: Project,
  hole: Hole,
  upload: { fileName: string; bytes: Buffer },
) {
  const summary = lasSummary(readOrRefuse(upload.bytes))
  const options = {
    version: summary.version,
    wrap: summary.wrap,
    depthUnit: summary.depthUnit,
    problems: summary.problems.slice(0, 50),
  }
  const row = await db.transaction(async (tx) => {
    const [created] = await tx
      .insert(imports)
      .values({
        projectId: project.id,
        holeId: hole.id,
        kind: 'las',
        status: 'previewed',
        fileName: upload.fileName,
        file: upload.bytes,
        options,
        rowCount: summary.sampleCount,
        message: `LAS ${summary.version}: ${summary.curves.length} curves, ${summary.sampleCount} samples`,
        createdBy: actorId,
      })
      .returning({ id: imports.id })
    const after = { fileName: upload.fileName, bytes: upload.bytes.length, ...options }
    await audit(tx, {
      projectId: project.id,
      userId: actorId,
      entity: 'import',
      entityId: created.id,
      action: 'create',
      after,
    })
    return created
  })
  const wellNameMatchesHole = summary.well.name !== null && sameName(summary.well.name, hole.name)
  return { importId: row.id, fileName: upload.fileName, ...summary, wellNameMatchesHole }
}

/** The LAS import `importId` of this hole (locked for update inside a transaction), or 404. */
async function lasImportOf(
  tx: Executor,
  project: Project,
  hole: Hole,
  importId: string,
  lock = false,
) {
  const query = tx
    .select()
    .from(imports)
    .where(
      and(
        eq(imports.id, importId),
        eq(imports.projectId, project.id),
        eq(imports.holeId, hole.id),
        eq(imports.kind, 'las'),
      ),
    )
  const [row] = lock ? await query.for('update') : await query
  if (!row) throw notFound('Import')
  return row
}

export interface CommitOptions {
  /** Metres added to every log depth: stored depth = log depth (m) + depthShift. */
  depthShift: number
  /** Mnemonics to keep; all curves but the index when absent. */
  curves?: string[]
}

/** Stores the chosen curves of a previewed import, one row each, in one transaction. */
export async function commitLasImport(
  db: Db,
  actorId: number,
  project: Project,
  hole: Hole,
  importId: string,
  options: CommitOptions,
) {
  return db.transaction(async (tx) => {
    const row = await lasImportOf(tx, project, hole, importId, true)
    if (row.status !== 'previewed') {
      throw conflict(`This import is already ${row.status}.`, 'import_not_previewed')
    }
    const choice = curvesToStore(readOrRefuse(row.file), options.curves, options.depthShift)
    if (choice.outOfRange) {
      const { min, max } = choice.outOfRange
      throw badRequest('The shifted log depths are out of range.', [
        {
          path: 'body.depthShift',
          message: `gives depths ${min.toFixed(2)}–${max.toFixed(2)} m; stored depths must lie within ${STORED_DEPTH_RANGE.min}–${STORED_DEPTH_RANGE.max} m`,
        },
      ])
    }
    if (choice.unknown.length > 0) {
      const details = choice.unknown.map((u) => ({
        path: `body.curves.${u.position}`,
        message: u.message,
      }))
      throw badRequest('Unknown curves.', details)
    }
    const curves =
      choice.curves.length === 0
        ? []
        : await tx
            .insert(logCurves)
            .values(
              choice.curves.map((c) => ({
                holeId: hole.id,
                importId: row.id,
                mnemonic: c.mnemonic,
                unit: c.unit,
                description: c.description,
                sourceFile: row.fileName,
                depthShift: options.depthShift,
                minDepth: c.minDepth,
                maxDepth: c.maxDepth,
                // bound as float8[] text: one parameter each, NULL kept for absent samples
                depths: sql`${c.depthsLiteral}::float8[]`,
                values: sql`${c.valuesLiteral}::float8[]`,
              })),
            )
            .returning({ id: logCurves.id, mnemonic: logCurves.mnemonic })
    const { skipped } = choice
    const committed = {
      ...(row.options as object),
      depthShift: options.depthShift,
      curves: curves.map((c) => c.mnemonic),
      skipped,
    }
    await tx
      .update(imports)
      .set({ status: 'committed', committedAt: new Date(), options: committed, progress: 100 })
      .where(eq(imports.id, row.id))
    await audit(tx, {
      projectId: project.id,
      userId: actorId,
      entity: 'import',
      entityId: row.id,
      action: 'import',
      after: { curves, depthShift: options.depthShift, skipped },
    })
    return { curves, skipped }
  })
}

export async function getImportFile(db: Db, project: Project, hole: Hole, importId: string) {
  const row = await lasImportOf(db, project, hole, importId)
  return { fileName: row.fileName, bytes: row.file }
}

/**
 * Survey stations from the import's deviation channels, for comparison only: nothing is written,
 * so no interval is touched. Adopting them is a survey replacement, which the freeze rules guard.
 */
export async function surveyFromDeviation(
  db: Db,
  project: Project,
  hole: Hole,
  importId: string,
  options: { interval: number; depthShift: number },
) {
  const file = readOrRefuse((await lasImportOf(db, project, hole, importId)).file)
  const survey = deviationSurvey(file, options.interval, options.depthShift)
  if (survey) return survey
  const message = 'The file has no hole azimuth and inclination channels in degrees.'
  throw badRequest(message, [], 'no_deviation')
}
