import { desc } from 'drizzle-orm'
import { capturedMails } from '../../../schema/index'
import type { Db } from '../db/client'

/** What the local fake SMTP server caught, newest first (the last 100). */
export const listCapturedMails = (db: Db) =>
  db
    .select()
    .from(capturedMails)
    .orderBy(desc(capturedMails.receivedAt), desc(capturedMails.id))
    .limit(100)

/** Empties the dev mailbox; resolves to the number of mails removed. */
export async function clearMailbox(db: Db): Promise<number> {
  const removed = await db.delete(capturedMails).returning({ id: capturedMails.id })
  return removed.length
}
