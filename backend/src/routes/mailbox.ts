import { Router } from 'express'
import { desc } from 'drizzle-orm'
import { capturedMails } from '../../../schema/index'
import type { Db } from '../db/client'
import type { Env } from '../env'
import { requireAdmin } from '../auth/guards'
import { notFound } from '../http/errors'
import { configureMail } from '../mail/transport'

/** /api/dev/mailbox: what the local fake SMTP server caught; absent when real mail is in use. */
export function mailboxRouter(db: Db, env: Env): Router {
  configureMail(env)
  const router = Router()
  router.use((_req, _res, next) => {
    if (env.FAKE_SMTP === '0') throw notFound('Mailbox')
    next()
  })
  router.use(requireAdmin)
  router.get('/', async (_req, res) => {
    const mails = await db
      .select()
      .from(capturedMails)
      .orderBy(desc(capturedMails.receivedAt), desc(capturedMails.id))
      .limit(100)
    res.json({ data: mails })
  })
  router.delete('/', async (_req, res) => {
    const removed = await db.delete(capturedMails).returning({ id: capturedMails.id })
    res.json({ data: { removed: removed.length } })
  })
  return router
}
