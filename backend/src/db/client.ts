import { drizzle, type NodePgDatabase } from 'drizzle-orm/node-postgres'
import pg from 'pg'
import * as schema from '../../../schema/index'

export type Db = NodePgDatabase<typeof schema>
export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0]
/** Services take either the database or an open transaction. */
export type Executor = Db | Tx

export function createDb(url: string, max = 10): { pool: pg.Pool; db: Db } {
  const pool = new pg.Pool({ connectionString: url, max })
  const db = drizzle(pool, { schema })
  return { pool, db }
}
