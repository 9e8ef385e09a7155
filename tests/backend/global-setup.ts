import type { TestProject } from 'vitest/node'
import { createDb } from '../../backend/src/db/client'
import { runMigrations } from '../../backend/src/db/migrate'

/** Migrates the throwaway database that npm test made for this run and hands its URL on. */
export default async function setup(project: TestProject) {
  const url = process.env.TEST_DATABASE_URL
  if (!url)
    throw new Error('TEST_DATABASE_URL is not set: run the backend tests through `npm test`.')
  const { db, pool } = createDb(url, 2)
  await runMigrations(db)
  await pool.end()
  project.provide('databaseUrl', url)
}

declare module 'vitest' {
  export interface ProvidedContext {
    databaseUrl: string
  }
}
