import type { Project } from '../../../schema/index'
import type { Db } from '../db/client'
import type { JobQueue } from '../jobs/queue'
import type { Logger } from '../logger'
import { runPackBuild } from './pack-build'
import type { PackSelection } from './pack-data'
import { createPack, requeuePack } from './packs'

export interface PackBuildDeps {
  db: Db
  /** Without a queue (a single process) the build runs in this process after the response. */
  jobs?: JobQueue
  logger?: Logger
}

/** The job carries the attempt the pack was queued with: a stale retry cannot build it again. */
async function queueBuild(
  { db, jobs, logger }: PackBuildDeps,
  pack: { id: string; attempt: string | null },
) {
  if (jobs) {
    await jobs.send('pack-build', { packId: pack.id, attempt: pack.attempt })
    return
  }
  setImmediate(() => {
    runPackBuild(db, pack.id, pack.attempt ?? undefined).catch((err: unknown) =>
      logger?.error({ err, packId: pack.id }, 'pack build failed'),
    )
  })
}

/** Creates a pack of the selection and queues its build; the pack as queued. */
export async function requestPack(
  deps: PackBuildDeps,
  actorId: number,
  project: Project,
  selection: PackSelection,
) {
  const pack = await createPack(deps.db, actorId, project, selection)
  await queueBuild(deps, pack)
  return pack
}

/** Queues a pack's build again (see requeuePack); the pack as queued. */
export async function rebuildPack(
  deps: PackBuildDeps,
  actorId: number,
  projectId: number,
  packId: string,
) {
  const pack = await requeuePack(deps.db, actorId, projectId, packId)
  await queueBuild(deps, pack)
  return pack
}
