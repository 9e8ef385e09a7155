import type { AddressInfo } from 'node:net'
import type { TestProject } from 'vitest/node'
import { createApp } from '../../backend/src/app'
import { createDb } from '../../backend/src/db/client'
import { runMigrations } from '../../backend/src/db/migrate'
import { seedDemo } from '../../backend/src/db/seed-demo'
import { loadEnv } from '../../backend/src/env'
import { createLogger } from '../../backend/src/logger'
import { createMailer } from '../../backend/src/mail/transport'

/**
 * Serves the built app and the API on a free loopback port, against a database of its own seeded
 * with the demo, for the browser tests.
 */
export default async function setup(project: TestProject) {
  const url = process.env.E2E_DATABASE_URL
  if (!url)
    throw new Error('E2E_DATABASE_URL is not set: run the browser tests through `npm test`.')
  const { db, pool } = createDb(url, 5)
  await runMigrations(db)
  await seedDemo(db)
  const env = loadEnv({ ...process.env, NODE_ENV: 'test', LOG_LEVEL: 'warn', DATABASE_URL: url })
  const logger = createLogger('warn')
  const app = createApp({ db, pool, env, logger, mail: createMailer(env, logger) })
  const server = app.listen(0, '127.0.0.1')
  await new Promise<void>((resolve) => server.once('listening', resolve))
  const { port } = server.address() as AddressInfo
  project.provide('baseUrl', `http://127.0.0.1:${port}`)
  return async () => {
    server.closeAllConnections()
    await new Promise<void>((resolve) => server.close(() => resolve()))
    await pool.end()
  }
}

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string
  }
}
