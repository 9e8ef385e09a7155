import { createHash, randomBytes } from 'node:crypto'
import { and, eq, gt, isNull, sql } from 'drizzle-orm'
import { authTokens, type AuthToken, type ProjectRole } from '../../../schema/index'
import type { Executor } from '../db/client'
import { ApiError, badRequest } from '../http/errors'

export type TokenPurpose = AuthToken['purpose']

export const INVITE_TTL_HOURS = 72
export const RESET_TTL_MINUTES = 60

/** 32 random bytes, base64url: what goes into the mailed link (never stored). */
export const newToken = () => randomBytes(32).toString('base64url')

/** SHA-256 hex: the only form a token is stored in, so a database leak yields no usable link. */
export const hashToken = (token: string) => createHash('sha256').update(token).digest('hex')

export interface TokenRequest {
  purpose: TokenPurpose
  email: string
  userId?: number | null
  projectId?: number | null
  role?: ProjectRole | null
  createdBy?: number | null
  ttlMs: number
}

/** Stores a new single-use token; returns the plain token (for the mail) and the row. */
export async function issueToken(tx: Executor, input: TokenRequest) {
  const token = newToken()
  const [row] = await tx
    .insert(authTokens)
    .values({
      purpose: input.purpose,
      email: input.email,
      userId: input.userId ?? null,
      projectId: input.projectId ?? null,
      role: input.role ?? null,
      createdBy: input.createdBy ?? null,
      tokenHash: hashToken(token),
      expiresAt: new Date(Date.now() + input.ttlMs),
    })
    .returning()
  return { token, row }
}

export const tokenUsed = () =>
  new ApiError(410, 'token_used', 'This link has already been used. Ask for a new one.')
export const tokenExpired = () =>
  new ApiError(410, 'token_expired', 'This link has expired. Ask for a new one.')
export const tokenInvalid = () =>
  badRequest(
    'This link is not valid.',
    [{ path: 'body.token', message: 'unknown token' }],
    'invalid_token',
  )

/** The token's row whatever its state, or undefined when no such token was issued. */
export async function findToken(db: Executor, purpose: TokenPurpose, token: string) {
  const [row] = await db
    .select()
    .from(authTokens)
    .where(and(eq(authTokens.purpose, purpose), eq(authTokens.tokenHash, hashToken(token))))
  return row
}

/** 410 for a used or expired token. */
export function assertUsable(row: AuthToken): void {
  if (row.usedAt) throw tokenUsed()
  if (row.expiresAt.getTime() <= Date.now()) throw tokenExpired()
}

/**
 * Marks the token used, in the caller's transaction. The conditional update is what makes a
 * token single-use: of two concurrent claims only one finds the row still unused.
 */
export async function claimToken(tx: Executor, purpose: TokenPurpose, token: string) {
  const row = await findToken(tx, purpose, token)
  if (!row) throw tokenInvalid()
  assertUsable(row)
  const [claimed] = await tx
    .update(authTokens)
    .set({ usedAt: new Date() })
    .where(
      and(
        eq(authTokens.id, row.id),
        isNull(authTokens.usedAt),
        gt(authTokens.expiresAt, sql`now()`),
      ),
    )
    .returning()
  if (!claimed) throw tokenUsed()
  return claimed
}
