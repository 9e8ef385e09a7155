import { and, eq, inArray } from 'drizzle-orm'
import { z } from 'zod'
import { packFiles, packs, projects, users } from '../../../schema/index'
import type { Db } from '../db/client'
import { ApiError } from '../http/errors'
import { buildPackFiles } from '../exports/pack-files'
import { holdLease, leaseEnd, leaseFree, newAttempt } from './leases'
import { loadPackData } from './pack-data'

/** The request body of a pack build; an empty body packs the whole project. */
export const PackSelectionBody = z
  .object({
    holeIds: z.array(z.number().int().positive()).max(500).optional(),
    intervalIds: z.array(z.number().int().positive()).max(2000).optional(),
  })
  .strict()

/** A stored selection: the request plus what the build resolved it to. */
export const StoredSelection = PackSelectionBody.extend({
  packed: z.object({ holeIds: z.array(z.number()), intervalIds: z.array(z.number()) }).optional(),
}).catch({})

/**
 * Builds a pack from scratch (its old files deleted first), so a retried job after a crash gives
 * the same result. The build claims the pack under a lease for its attempt (see services/leases):
 * a stale attempt cannot claim it, and only the attempt named on the row may write the files.
 * Progress and message are written as it goes; it ends `ready` or `failed`. A refusal (the
 * selection no longer exists) is final; other errors are rethrown for a retry.
 */
export async function runPackBuild(db: Db, packId: string, jobAttempt?: string): Promise<void> {
  const attempt = jobAttempt ?? newAttempt()
  const [pack] = await db
    .update(packs)
    .set({
      status: 'building',
      progress: 5,
      message: 'Reading data',
      contentHash: null,
      attempt,
      leaseUntil: leaseEnd(),
    })
    .where(
      and(
        eq(packs.id, packId),
        inArray(packs.status, ['queued', 'building']),
        jobAttempt ? eq(packs.attempt, jobAttempt) : undefined,
        leaseFree(packs),
      ),
    )
    .returning()
  if (!pack) return
  const mine = and(eq(packs.id, packId), eq(packs.attempt, attempt), eq(packs.status, 'building'))
  const releaseLease = holdLease(db, packs, packId, attempt)
  const step = (progress: number, message: string) =>
    db
      .update(packs)
      .set({ progress, message })
      .where(mine)
      .then(() => undefined)
  await db.delete(packFiles).where(eq(packFiles.packId, packId))
  try {
    const [project] = await db.select().from(projects).where(eq(projects.id, pack.projectId))
    const [who] = pack.createdBy
      ? await db.select({ name: users.name }).from(users).where(eq(users.id, pack.createdBy))
      : []
    const { packed: _packed, ...selection } = StoredSelection.parse(pack.selection)
    const data = await loadPackData(db, project, selection)
    const packed = {
      holeIds: data.holes.map((h) => h.id),
      intervalIds: data.intervals.map((i) => i.interval.id),
    }
    await db
      .update(packs)
      .set({
        selection: { ...selection, packed },
        inputsHash: data.inputsHash,
        draft: data.draft,
        progress: 30,
        message: 'Data read; writing files',
      })
      .where(mine)
    const files = await buildPackFiles(
      data,
      { packId, builtBy: who?.name ?? 'unknown', builtAt: new Date() },
      step,
    )
    await db.transaction(async (tx) => {
      const [still] = await tx.select().from(packs).where(mine).for('update')
      if (!still) return
      await tx.delete(packFiles).where(eq(packFiles.packId, packId))
      await tx.insert(packFiles).values(files.map((f) => ({ ...f, packId })))
      await tx
        .update(packs)
        .set({
          status: 'ready',
          progress: 100,
          message: `${data.draft ? 'Draft preview' : 'Ready'}: ${files.length} files`,
          attempt: null,
          leaseUntil: null,
        })
        .where(eq(packs.id, packId))
    })
  } catch (err: unknown) {
    const message = err instanceof Error ? err.message : String(err)
    await db
      .update(packs)
      .set({
        status: 'failed',
        message: `Build failed: ${message}`.slice(0, 1000),
        leaseUntil: null,
      })
      .where(mine)
    if (!(err instanceof ApiError)) throw err
  } finally {
    releaseLease()
  }
}
