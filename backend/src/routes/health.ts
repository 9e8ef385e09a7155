import { Router } from 'express'
import { sql } from 'drizzle-orm'
import type { Db } from '../db/client'

/** GET /api/health: the app answers and the database does too. */
export function healthRouter(db: Db): Router {
  const router = Router()
  router.get('/', async (_req, res) => {
    let database = false
    try {
      await db.execute(sql`select 1`)
      database = true
    } catch {
      database = false
    }
    res.status(database ? 200 : 503).json({ data: { ok: database, database } })
  })
  return router
}
