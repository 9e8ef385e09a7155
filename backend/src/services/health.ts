import { sql } from 'drizzle-orm'
import type { Db } from '../db/client'

/**
 * Whether the database answers `select 1` within `timeoutMs`; false when it fails or is slower
 * (so a load balancer asking never waits on a database that is away).
 */
export async function databaseAnswers(db: Db, timeoutMs: number): Promise<boolean> {
  let timer: NodeJS.Timeout | undefined
  const timeout = new Promise<never>((_, reject) => {
    timer = setTimeout(
      () => reject(new Error('timeout exceeded when trying to connect')),
      timeoutMs,
    )
  })
  try {
    await Promise.race([db.execute(sql`select 1`), timeout])
    return true
  } catch {
    return false
  } finally {
    clearTimeout(timer)
  }
}
