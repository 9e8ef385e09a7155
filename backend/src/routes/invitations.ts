import { Router } from 'express'
import { z } from 'zod'
import { projectRoles } from '../../../schema/index'
import type { Db } from '../db/client'
import { newCsrfToken } from '../auth/csrf'
import { requireSignedIn } from '../auth/guards'
import { inputOf, validate } from '../http/validate'
import type { Mailer } from '../mail/transport'
import { acceptInvitation } from '../services/invitation-accept'
import { createInvitation, describeInvitation } from '../services/invitations'
import { membershipsOf } from '../services/memberships'

const InvitationBody = z
  .object({
    email: z.string().trim().toLowerCase().email().max(254),
    projectId: z.number().int().positive().optional(),
    role: z.enum(projectRoles).optional(),
  })
  .strict()
  .refine((b) => b.role === undefined || b.projectId !== undefined, {
    path: ['role'],
    message: 'a role needs a projectId',
  })

// base64url of 32 bytes is 43 characters; anything else cannot be one of ours.
const Token = z.string().regex(/^[A-Za-z0-9_-]{43}$/, 'not an invitation token')
const TokenParams = z.object({ token: Token })
const AcceptBody = z
  .object({
    token: Token,
    name: z.string().trim().min(1).max(120).optional(),
    password: z.string().min(10).max(200),
  })
  .strict()

/** /api/invitations: invite by e-mail (admin or project lead), then accept with the mailed link. */
export function invitationsRouter(db: Db, mail: Mailer): Router {
  const router = Router()

  router.post('/', requireSignedIn, validate({ body: InvitationBody }), async (req, res) => {
    const { body } = inputOf(res, { body: InvitationBody })
    res.status(201).json({ data: await createInvitation(db, mail, req.user!, body) })
  })

  router.post('/accept', validate({ body: AcceptBody }), async (req, res) => {
    const { body } = inputOf(res, { body: AcceptBody })
    const user = await acceptInvitation(db, body)
    // req.login regenerates the session (fixation defence), so a fresh CSRF token follows.
    await new Promise<void>((resolve, reject) =>
      req.login(user, (err: unknown) => (err ? reject(err) : resolve())),
    )
    req.session.signedInAt = Date.now()
    const csrfToken = newCsrfToken(req)
    res.json({ data: { user, memberships: await membershipsOf(db, user.id), csrfToken } })
  })

  router.get('/:token', validate({ params: TokenParams }), async (_req, res) => {
    const { params } = inputOf(res, { params: TokenParams })
    res.json({ data: await describeInvitation(db, params.token) })
  })

  return router
}
