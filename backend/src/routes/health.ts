import { Router } from 'express'
import type { Db } from '../db/client'
import { databaseUnavailable } from '../http/error-handler'
import { databaseAnswers } from '../services/health'

/**
 * GET /api/health: the app answers and the database does too; 503 naming the database while it is
 * away (the check gives up after two seconds, so a load balancer never waits on it).
 */
export function healthRouter(db: Db): Router {
  const router = Router()
  router.get('/', async (_req, res) => {
    if (await databaseAnswers(db, 2000)) {
      res.json({ data: { ok: true, database: true } })
      return
    }
    const e = databaseUnavailable()
    res.status(503).json({
      data: { ok: false, database: false },
      error: { code: e.code, message: e.message, details: e.details },
    })
  })
  return router
}
