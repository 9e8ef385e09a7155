import type { Request } from 'express'
import { z } from 'zod'
import { badRequest } from './errors'
import type { IdempotencyRequest } from '../services/idempotency'

/** Printable ASCII, as the IETF draft "The Idempotency-Key HTTP Header Field" suggests (a UUID is typical). */
const Key = z
  .string()
  .min(8)
  .max(200)
  .regex(/^[\x21-\x7e]+$/, 'printable ASCII without spaces')

/** The request's `Idempotency-Key`, bound to the signed-in user and route; undefined without one. */
export function idempotencyOf(req: Request, body: unknown): IdempotencyRequest | undefined {
  const raw = req.get('Idempotency-Key')
  if (raw === undefined) return undefined
  const parsed = Key.safeParse(raw)
  if (!parsed.success)
    throw badRequest('Invalid Idempotency-Key header.', [
      { path: 'header.idempotency-key', message: parsed.error.issues[0].message },
    ])
  return {
    userId: req.user!.id,
    key: parsed.data,
    route: `${req.method} ${req.baseUrl}${req.path}`,
    body,
  }
}
