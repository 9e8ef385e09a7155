import { and, eq, isNull, ne, sql } from 'drizzle-orm'
import { authTokens, sessions, users } from '../../../schema/index'
import type { Db } from '../db/client'
import { hashPassword } from '../auth/passport'
import { resetMail } from '../mail/messages'
import type { Mailer } from '../mail/transport'
import { audit } from './audit'
import { claimToken, issueToken, RESET_TTL_MINUTES, tokenInvalid } from './tokens'

/**
 * Issues and mails a reset link when the e-mail belongs to an enabled account; otherwise does
 * nothing. The mail is sent in the background so both paths answer in about the same time and
 * the answer never tells whether the account exists.
 */
export async function requestPasswordReset(db: Db, mail: Mailer, email: string): Promise<void> {
  const [user] = await db
    .select()
    .from(users)
    .where(eq(sql`lower(${users.email})`, email.toLowerCase()))
  if (!user || user.disabled) return
  const { token, row } = await db.transaction(async (tx) => {
    const issued = await issueToken(tx, {
      purpose: 'reset',
      email: user.email,
      userId: user.id,
      ttlMs: RESET_TTL_MINUTES * 60_000,
    })
    await audit(tx, {
      projectId: null,
      userId: user.id,
      entity: 'password_reset',
      entityId: issued.row.id,
      action: 'request',
    })
    return issued
  })
  const link = mail.link(`/reset-password?token=${token}`)
  const content = resetMail({ name: user.name, link, minutes: RESET_TTL_MINUTES })
  void mail
    .send({ to: user.email, ...content })
    .catch((err: unknown) => mail.logger.warn({ err, tokenId: row.id }, 'reset mail not sent'))
}

/**
 * Sets the new password, uses up the token and every other outstanding reset token of the account,
 * and ends the user's other sessions (all but `keepSessionId`), in one transaction.
 */
export async function resetPassword(
  db: Db,
  input: { token: string; password: string },
  keepSessionId: string,
): Promise<void> {
  const passwordHash = await hashPassword(input.password)
  await db.transaction(async (tx) => {
    const token = await claimToken(tx, 'reset', input.token)
    if (!token.userId) throw tokenInvalid()
    const [user] = await tx
      .update(users)
      .set({ passwordHash, version: sql`${users.version} + 1`, updatedAt: new Date() })
      .where(and(eq(users.id, token.userId), eq(users.disabled, false)))
      .returning({ id: users.id })
    if (!user) throw tokenInvalid()
    // Every other reset link of the account dies with this one (ASVS 4.0 V2.5).
    const revoked = await tx
      .update(authTokens)
      .set({ usedAt: new Date() })
      .where(
        and(
          eq(authTokens.purpose, 'reset'),
          eq(authTokens.userId, user.id),
          isNull(authTokens.usedAt),
        ),
      )
      .returning({ id: authTokens.id })
    await tx
      .delete(sessions)
      .where(
        and(
          sql`${sessions.sess}->'passport'->>'user' = ${String(user.id)}`,
          ne(sessions.sid, keepSessionId),
        ),
      )
    await audit(tx, {
      projectId: null,
      userId: user.id,
      entity: 'user',
      entityId: user.id,
      action: 'password_reset',
      after: { otherResetLinksRevoked: revoked.length },
    })
  })
}
