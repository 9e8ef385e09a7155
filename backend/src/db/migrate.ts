import { migrate } from 'drizzle-orm/node-postgres/migrator'
import { fileURLToPath } from 'node:url'
import type { Db } from './client'

export const migrationsFolder = fileURLToPath(
  new URL('../../../schema/migrations', import.meta.url),
)

/** Applies drizzle-kit's committed migrations; safe to call on every start. */
export async function runMigrations(db: Db): Promise<void> {
  await migrate(db, { migrationsFolder })
}
