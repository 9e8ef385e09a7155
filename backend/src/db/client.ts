import { drizzle, type NodePgDatabase } from 'drizzle-orm/node-postgres'
import pg from 'pg'
import * as schema from '../../../schema/index'

export type Db = NodePgDatabase<typeof schema>
export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0]
/** Services take either the database or an open transaction. */
export type Executor = Db | Tx

/**
 * A pool and its Drizzle handle. The pool never takes the process down: an idle connection that
 * dies with the database (restart, failover) is reported to `onError` and replaced on next use, and
 * a connection attempt gives up after `connectTimeoutMs` so requests answer 503 instead of hanging.
 */
export function createDb(
  url: string,
  max = 10,
  onError: (err: Error) => void = () => {},
  connectTimeoutMs = 5000,
): { pool: pg.Pool; db: Db } {
  const pool = new pg.Pool({
    connectionString: url,
    max,
    connectionTimeoutMillis: connectTimeoutMs,
  })
  pool.on('error', onError)
  // A connection that dies while checked out (a query in flight when PostgreSQL is killed) emits
  // 'error' on its client, where pg-pool has no listener: without one the process would crash.
  pool.on('connect', (client) => client.on('error', onError))
  const db = drizzle(pool, { schema })
  return { pool, db }
}

const unavailableCodes = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'ETIMEDOUT',
  'EPIPE',
  'ENOTFOUND',
  'EAI_AGAIN',
  // PostgreSQL: connection exceptions (class 08) and operator intervention (57P01–57P03)
  '08000',
  '08001',
  '08003',
  '08004',
  '08006',
  '57P01',
  '57P02',
  '57P03',
])
const unavailableMessages = [
  'Connection terminated',
  'timeout exceeded when trying to connect',
  'Client has encountered a connection error',
]

/** True when an error (or its cause, as Drizzle wraps driver errors) means the database is away. */
export function isDatabaseUnavailable(err: unknown, depth = 0): boolean {
  if (typeof err !== 'object' || err === null || depth > 4) return false
  const e = err as { code?: unknown; message?: unknown; cause?: unknown; errors?: unknown }
  if (typeof e.code === 'string' && unavailableCodes.has(e.code)) return true
  if (
    typeof e.message === 'string' &&
    unavailableMessages.some((m) => String(e.message).includes(m))
  )
    return true
  if (Array.isArray(e.errors) && e.errors.some((x) => isDatabaseUnavailable(x, depth + 1)))
    return true
  return isDatabaseUnavailable(e.cause, depth + 1)
}
