import type pg from 'pg'
import type { Hole } from '../../../schema/index'
import type { Db } from '../db/client'
import type { JobQueue } from '../jobs/queue'
import type { Mailer } from '../mail/transport'
import { commitImport, queueImport } from './import-commit'
import { assertNotDuplicate } from './import-guards'
import { BACKGROUND_ROWS, getImport, importView } from './imports'

export interface ImportCommitDeps {
  db: Db
  pool: pg.Pool
  mail: Mailer
  /** Without a queue (single-process tests) every import commits within the request. */
  jobs?: JobQueue
}

/**
 * The commit a person asks for. Over BACKGROUND_ROWS rows (with a queue) it is queued as the
 * 'import-commit' job — a repeat of a committed file is refused first, so the caller hears it
 * now (the job checks again); anything smaller commits here. Returns the import as it now reads
 * and whether it was queued.
 */
export async function requestImportCommit(
  { db, pool, mail, jobs }: ImportCommitDeps,
  actorId: number,
  hole: Hole,
  importId: string,
  confirmDuplicate: boolean,
) {
  const found = await getImport(db, hole.projectId, hole.id, importId)
  const queued = jobs !== undefined && found.rowCount > BACKGROUND_ROWS
  if (queued) {
    if (found.status === 'previewed') await assertNotDuplicate(db, found, confirmDuplicate)
    const attempt = await queueImport(db, found.id)
    await jobs.send('import-commit', { importId: found.id, attempt, actorId, confirmDuplicate })
  } else {
    await commitImport(db, mail, pool, found.id, { fromJob: false, actorId, confirmDuplicate })
  }
  return { queued, import: importView(await getImport(db, hole.projectId, hole.id, found.id)) }
}
