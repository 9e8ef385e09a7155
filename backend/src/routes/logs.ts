import { Router } from 'express'
import type { Db } from '../db/client'

/** /api/projects/:projectId/holes/:holeId/logs: LAS curves (being built). */
export function logsRouter(_db: Db): Router {
  return Router({ mergeParams: true })
}
