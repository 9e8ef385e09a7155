import { Router } from 'express'
import { CommentBody, CommentQuery } from '../../../schema/index'
import { projectLocals, requireRole } from '../auth/guards'
import { inputOf, validate } from '../http/validate'
import type { ProjectDeps } from './deps'
import { addComment, listComments } from '../services/comments'

/** /api/projects/:projectId/comments: on structures and intervals; members read, loggers and up write. */
export function commentsRouter({ db, mail }: Pick<ProjectDeps, 'db' | 'mail'>): Router {
  const router = Router({ mergeParams: true })
  router.get('/', validate({ query: CommentQuery }), async (_req, res) => {
    const { query } = inputOf(res, { query: CommentQuery })
    res.json({
      data: await listComments(db, projectLocals(res).project.id, query.entity, query.entityId),
    })
  })
  router.post('/', requireRole('logger'), validate({ body: CommentBody }), async (req, res) => {
    const { body } = inputOf(res, { body: CommentBody })
    const row = await addComment(
      db,
      mail,
      { id: req.user!.id, name: req.user!.name },
      projectLocals(res).project.id,
      body,
    )
    res.status(201).json({ data: row })
  })
  return router
}
