import { and, eq, inArray } from 'drizzle-orm'
import { drizzle } from 'drizzle-orm/node-postgres'
import type pg from 'pg'
import * as schema from '../../../schema/index'
import { holes, imports, projects } from '../../../schema/index'
import type { Db } from '../db/client'
import type { Mailer } from '../mail/transport'
import { conflict } from '../http/errors'
import { analyseCsv, type CsvImportKind } from '../imports/analyse'
import { audit } from './audit'
import { assertNotFrozen, demoteChecked, noticeDemoted, type Demoted } from './freeze'
import { applyImport } from './import-apply'
import { assertNotDuplicate, intervalsReached, isFrozen, reachOf } from './import-guards'
import { rowErrorsFail, type StoredSettings } from './imports'
import { holdLease, leaseEnd, leaseFree, newAttempt } from './leases'

/**
 * Moves an import to `committing` under a fresh lease; only one caller can win. A request takes a
 * previewed import, or one whose commit failed (an interrupted one too), as a new attempt; a job
 * takes only the attempt it was queued with, so a stale retry never commits what a person has
 * since committed again.
 */
async function claim(db: Db, id: string, fromJob: boolean, jobAttempt?: string) {
  const attempt = fromJob && jobAttempt ? jobAttempt : newAttempt()
  const [row] = await db
    .update(imports)
    .set({ status: 'committing', progress: 0, message: '', attempt, leaseUntil: leaseEnd() })
    .where(
      fromJob
        ? and(
            eq(imports.id, id),
            inArray(imports.status, ['queued', 'committing', 'failed']),
            jobAttempt ? eq(imports.attempt, jobAttempt) : undefined,
            leaseFree(imports),
          )
        : and(eq(imports.id, id), inArray(imports.status, ['previewed', 'failed'])),
    )
    .returning()
  return row ? { row, attempt } : undefined
}

/** Marks the import as waiting for a worker; the job it is handed carries the returned attempt. */
export async function queueImport(db: Db, id: string): Promise<string> {
  const attempt = newAttempt()
  const [row] = await db
    .update(imports)
    .set({ status: 'queued', message: 'waiting for a worker', attempt, leaseUntil: null })
    .where(and(eq(imports.id, id), inArray(imports.status, ['previewed', 'failed'])))
    .returning({ id: imports.id })
  if (!row)
    throw conflict('This import is already committed or being committed.', 'import_not_pending')
  return attempt
}

export interface CommitOptions {
  fromJob: boolean
  actorId: number
  /** The caller saw that the same file was committed here before and commits it again anyway. */
  confirmDuplicate?: boolean
  /** The attempt a queued job was handed (see queueImport). */
  attempt?: string
}

const REASON = 'an import changed rows inside it'

/**
 * Commits a previewed (or queued) import in ONE transaction. The rows are read again against the
 * hole as it is now (final depth); the same file already committed here needs `confirmDuplicate`
 * (409 `duplicate_import`); rows reaching an approved interval refuse the commit (409,
 * assertNotFrozen) and checked intervals they reach go back to draft. Any failure rolls everything
 * back; the import then reads `failed` with the reason (from a job) or stays `previewed` (from a
 * request, which sees the error itself).
 */
export async function commitImport(
  db: Db,
  mail: Mailer,
  pool: pg.Pool,
  id: string,
  opts: CommitOptions,
) {
  const won = await claim(db, id, opts.fromJob, opts.attempt)
  if (!won)
    throw conflict('This import is already committed or being committed.', 'import_not_pending')
  const { row: claimed, attempt } = won
  const releaseLease = holdLease(db, imports, id, attempt)
  const client = await pool.connect()
  const tx = drizzle(client, { schema })
  let demoted: Demoted[] = []
  let told: { projectId: number; hole: { id: number; name: string } } | undefined
  try {
    await client.query('begin')
    const [project] = await tx.select().from(projects).where(eq(projects.id, claimed.projectId))
    const [hole] = await tx.select().from(holes).where(eq(holes.id, claimed.holeId!)).for('update')
    await assertNotDuplicate(tx, claimed, opts.confirmDuplicate === true)
    const settings = claimed.options as StoredSettings
    const a = analyseCsv(
      claimed.kind as CsvImportKind,
      claimed.file,
      settings.mapping,
      settings.options,
      { finalDepth: hole.finalDepth },
    )
    if (a.errors.length) rowErrorsFail(a)
    const userId = opts.actorId
    const reached = await intervalsReached(tx, hole.id, reachOf(a))
    await assertNotFrozen(tx, hole.id, { intervalIds: reached.filter(isFrozen).map((i) => i.id) })
    const checked = reached.filter((i) => i.status === 'checked').map((i) => i.id)
    demoted = await demoteChecked(tx, userId, project.id, hole.id, { intervalIds: checked }, REASON)
    const replaced = await applyImport({ db, tx, client, project, hole, importId: id, userId }, a)
    // Only this attempt may finish: if its lease lapsed and the sweep took the row, roll back.
    const [mine] = await tx
      .update(imports)
      .set({
        status: 'committed',
        progress: 100,
        committedAt: new Date(),
        message: '',
        replaced: replaced ?? null,
        attempt: null,
        leaseUntil: null,
      })
      .where(
        and(eq(imports.id, id), eq(imports.attempt, attempt), eq(imports.status, 'committing')),
      )
      .returning({ id: imports.id })
    if (!mine)
      throw conflict(
        'This commit was interrupted and taken over: nothing was stored.',
        'import_interrupted',
      )
    await audit(tx, {
      projectId: project.id,
      userId,
      entity: 'import',
      entityId: id,
      action: 'import',
      after: {
        kind: a.kind,
        fileName: claimed.fileName,
        sha256: claimed.sha256,
        rows: a.rows.length,
        replaced: replaced?.rows.length ?? 0,
        duplicateConfirmed: opts.confirmDuplicate === true,
        ...settings,
      },
    })
    await client.query('commit')
    told = { projectId: project.id, hole }
    return { status: 'committed' as const, rowCount: a.rows.length }
  } catch (err: unknown) {
    await client.query('rollback')
    const message = err instanceof Error ? err.message : String(err)
    await db
      .update(imports)
      .set({
        ...(opts.fromJob ? { status: 'failed' as const } : { status: 'previewed' as const }),
        message,
        leaseUntil: null,
      })
      .where(and(eq(imports.id, id), eq(imports.attempt, attempt)))
    throw err
  } finally {
    releaseLease()
    client.release()
    // After the commit only: a checker is never told of a change that was rolled back.
    if (told) await noticeDemoted(db, mail, told.projectId, told.hole, demoted, REASON)
  }
}
