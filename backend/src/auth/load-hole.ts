import type { RequestHandler } from 'express'
import { IdParam, type Hole } from '../../../schema/index'
import type { Db } from '../db/client'
import { notFound } from '../http/errors'
import { getHole } from '../services/holes'
import { projectLocals } from './guards'

const HoleParams = IdParam('holeId')

/** What the routes below a hole find on res.locals after `loadHole`. */
export function holeLocals(res: { locals: Record<string, unknown> }): Hole {
  return res.locals.hole as Hole
}

/**
 * Finds `:holeId` in the project `loadProject` found: another project's hole, an unknown id or a
 * deleted hole → 404. Mounted once for /holes/:holeId, ahead of every route below a hole, so the
 * hole is checked before any body is read (no 50 MB upload for a hole that is not there).
 */
export function loadHole(db: Db): RequestHandler {
  return async (req, res, next) => {
    const id = HoleParams.safeParse(req.params)
    if (!id.success) throw notFound('Hole')
    res.locals.hole = await getHole(db, projectLocals(res).project.id, id.data.holeId)
    next()
  }
}
