import { Router } from 'express'
import type { Db } from '../db/client'
import type { Env } from '../env'
import { requireAdmin } from '../auth/guards'
import { notFound } from '../http/errors'
import { clearMailbox, listCapturedMails } from '../services/mailbox'

/** /api/dev/mailbox: what the local fake SMTP server caught; absent when real mail is in use. */
export function mailboxRouter(db: Db, env: Pick<Env, 'FAKE_SMTP'>): Router {
  const router = Router()
  router.use((_req, _res, next) => {
    if (env.FAKE_SMTP === '0') throw notFound('Mailbox')
    next()
  })
  router.use(requireAdmin)
  router.get('/', async (_req, res) => {
    res.json({ data: await listCapturedMails(db) })
  })
  router.delete('/', async (_req, res) => {
    res.json({ data: { removed: await clearMailbox(db) } })
  })
  return router
}
