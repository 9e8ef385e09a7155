import bcrypt from 'bcryptjs'
import { memberships, users } from '../../../schema/index'
import type { Db } from '../db/client'
import { hashPassword } from '../auth/passport'
import { ApiError, badRequest } from '../http/errors'
import { audit } from './audit'
import { userByEmail } from './invitations'
import { assertUsable, claimToken, findToken } from './tokens'

/**
 * Accepts an invitation: creates the account (or, for an existing one, checks its password),
 * adds the membership and uses up the token, all in one transaction. Returns the user to sign in.
 */
export async function acceptInvitation(
  db: Db,
  input: { token: string; name?: string; password: string },
): Promise<Express.User> {
  const pending = await findToken(db, 'invite', input.token)
  if (!pending)
    throw badRequest(
      'This invitation link is not valid.',
      [{ path: 'body.token', message: 'unknown token' }],
      'invalid_token',
    )
  assertUsable(pending)
  const existing = await userByEmail(db, pending.email)
  if (existing?.disabled) throw new ApiError(403, 'account_disabled', 'This account is disabled.')
  if (existing && !(await bcrypt.compare(input.password, existing.passwordHash)))
    throw new ApiError(401, 'invalid_credentials', 'Enter the password of your existing account.')
  if (!existing && !input.name)
    throw badRequest('Your name is needed.', [{ path: 'body.name', message: 'required' }])
  const passwordHash = existing ? null : await hashPassword(input.password)
  return db.transaction(async (tx) => {
    const token = await claimToken(tx, 'invite', input.token)
    let user = existing
    if (!user) {
      ;[user] = await tx
        .insert(users)
        .values({ email: token.email, name: input.name!, passwordHash: passwordHash! })
        .returning()
      const { passwordHash: _secret, ...after } = user
      await audit(tx, {
        projectId: null,
        userId: user.id,
        entity: 'user',
        entityId: user.id,
        action: 'create',
        after,
      })
    }
    if (token.projectId && token.role) {
      const added = await tx
        .insert(memberships)
        .values({ projectId: token.projectId, userId: user.id, role: token.role })
        .onConflictDoNothing()
        .returning()
      if (added.length)
        await audit(tx, {
          projectId: token.projectId,
          userId: user.id,
          entity: 'membership',
          entityId: user.id,
          action: 'create',
          after: added[0],
        })
    }
    await audit(tx, {
      projectId: token.projectId,
      userId: user.id,
      entity: 'invitation',
      entityId: token.id,
      action: 'accept',
    })
    return { id: user.id, email: user.email, name: user.name, isAdmin: user.isAdmin }
  })
}
