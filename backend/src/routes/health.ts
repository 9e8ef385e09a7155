import { Router } from 'express'
import { sql } from 'drizzle-orm'
import type { Db } from '../db/client'
import { databaseUnavailable } from '../http/error-handler'

/**
 * GET /api/health: the app answers and the database does too; 503 naming the database while it is
 * away (the check gives up after two seconds, so a load balancer never waits on it).
 */
export function healthRouter(db: Db): Router {
  const router = Router()
  router.get('/', async (_req, res) => {
    let timer: NodeJS.Timeout | undefined
    const timeout = new Promise<never>((_, reject) => {
      timer = setTimeout(() => reject(new Error('timeout exceeded when trying to connect')), 2000)
    })
    try {
      await Promise.race([db.execute(sql`select 1`), timeout])
      res.json({ data: { ok: true, database: true } })
    } catch {
      const e = databaseUnavailable()
      res.status(503).json({
        data: { ok: false, database: false },
        error: { code: e.code, message: e.message, details: e.details },
      })
    } finally {
      clearTimeout(timer)
    }
  })
  return router
}
