import { and, asc, eq } from 'drizzle-orm'
import { users, type UserCreate } from '../../../schema/index'
import type { Db } from '../db/client'
import { hashPassword } from '../auth/passport'
import { badRequest, staleVersion } from '../http/errors'
import { audit, withoutSecrets } from './audit'

const userColumns = {
  id: users.id,
  email: users.email,
  name: users.name,
  isAdmin: users.isAdmin,
  disabled: users.disabled,
  version: users.version,
}

export const listUsers = (db: Db) => db.select(userColumns).from(users).orderBy(asc(users.name))

export async function createUser(db: Db, actorId: number | null, input: UserCreate) {
  const passwordHash = await hashPassword(input.password)
  return db.transaction(async (tx) => {
    const [row] = await tx
      .insert(users)
      .values({
        email: input.email,
        name: input.name,
        isAdmin: input.isAdmin ?? false,
        passwordHash,
      })
      .returning(userColumns)
    await audit(tx, {
      projectId: null,
      userId: actorId,
      entity: 'user',
      entityId: row.id,
      action: 'create',
      after: row,
    })
    return row
  })
}

export async function updateUser(
  db: Db,
  actorId: number,
  userId: number,
  input: { version: number; name?: string; isAdmin?: boolean; disabled?: boolean },
) {
  const { version, ...fields } = input
  if (userId === actorId && (fields.disabled || fields.isAdmin === false)) {
    throw badRequest('You cannot disable yourself or drop your own admin flag.', [], 'self_lockout')
  }
  return db.transaction(async (tx) => {
    const [before] = await tx.select().from(users).where(eq(users.id, userId))
    if (!before)
      throw badRequest('No such user', [{ path: 'params.userId', message: 'no such user' }])
    const [after] = await tx
      .update(users)
      .set({ ...fields, version: version + 1, updatedAt: new Date() })
      .where(and(eq(users.id, userId), eq(users.version, version)))
      .returning(userColumns)
    if (!after) throw staleVersion()
    await audit(tx, {
      projectId: null,
      userId: actorId,
      entity: 'user',
      entityId: userId,
      action: 'update',
      before: withoutSecrets(before),
      after,
    })
    return after
  })
}
