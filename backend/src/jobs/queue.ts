import PgBoss from 'pg-boss'
import type { Logger } from '../logger'

/** Background work kept in PostgreSQL (pg-boss), so any app server can pick up any job. */
export interface JobQueue {
  send: (name: JobName, data: Record<string, unknown>) => Promise<string | null>
  stop: () => Promise<void>
}

export const jobNames = ['import-commit', 'pack-build', 'image-tiling'] as const
export type JobName = (typeof jobNames)[number]
export type JobHandler = (data: Record<string, unknown>) => Promise<void>

/**
 * Starts the queue and this server's workers (one per handler given; every queue is created so any
 * server can send to it). A job that dies with its server is retried after
 * it expires (retryLimit 2): handlers must be safe to run again (each commits in one transaction).
 */
export async function startJobQueue(
  connectionString: string,
  handlers: Partial<Record<JobName, JobHandler>>,
  logger: Logger,
): Promise<JobQueue> {
  const boss = new PgBoss({ connectionString, max: 4, schema: 'pgboss' })
  boss.on('error', (err: unknown) => logger.error({ err }, 'job queue error'))
  await boss.start()
  for (const name of jobNames) {
    await boss.createQueue(name, { name, retryLimit: 2, retryDelay: 5, expireInSeconds: 15 * 60 })
    const handler = handlers[name]
    if (!handler) continue
    await boss.work<Record<string, unknown>>(name, { pollingIntervalSeconds: 1 }, async (jobs) => {
      for (const job of jobs) {
        logger.info({ job: job.id, name }, 'job started')
        await handler(job.data)
        logger.info({ job: job.id, name }, 'job done')
      }
    })
  }
  return {
    send: (name, data) => boss.send(name, data),
    stop: () => boss.stop({ graceful: true, wait: true, timeout: 20_000 }),
  }
}
