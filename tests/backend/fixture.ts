import { sql } from 'drizzle-orm'
import request from 'supertest'
import { inject } from 'vitest'
import type { Express } from 'express'
import { createApp } from '../../backend/src/app'
import { createDb, type Db } from '../../backend/src/db/client'
import { loadEnv } from '../../backend/src/env'
import { createLogger } from '../../backend/src/logger'
import { createMailer, type Mailer } from '../../backend/src/mail/transport'
import { hashPassword } from '../../backend/src/auth/passport'
import { holes, memberships, projects, users, type ProjectRole } from '../../schema/index'

export const PASSWORD = 'test-password-1'
export const actors = ['admin', 'lead', 'engineer', 'logger', 'viewer', 'outsider'] as const
export type Actor = (typeof actors)[number]

export interface Fixture {
  db: Db
  app: Express
  /** The app's mailer, for a test that sends a mail itself. */
  mail: Mailer
  projectId: number
  otherProjectId: number
  holeId: number
  userIds: Record<Actor, number>
  close: () => Promise<void>
}

/** The app against the test database, wiped and filled with one project and a user per role. */
export async function createFixture(envOverrides: Record<string, string> = {}): Promise<Fixture> {
  const { db, pool } = createDb(inject('databaseUrl'), 4)
  // Mail goes nowhere unless a test starts its own fake SMTP server and says where it listens.
  const env = loadEnv({
    ...process.env,
    NODE_ENV: 'test',
    LOG_LEVEL: 'silent',
    SMTP_URL: 'smtp://127.0.0.1:9',
    ...envOverrides,
  })
  const logger = createLogger('silent')
  const mail = createMailer(env, logger)
  const app = createApp({ db, pool, env, logger, mail })
  await wipe(db)
  const passwordHash = await hashPassword(PASSWORD)
  const userIds = {} as Record<Actor, number>
  for (const who of actors) {
    const [u] = await db
      .insert(users)
      .values({ email: `${who}@test.example`, name: who, isAdmin: who === 'admin', passwordHash })
      .returning()
    userIds[who] = u.id
  }
  const [project] = await db
    .insert(projects)
    .values({
      code: 'TST',
      name: 'Test project',
      crsEpsg: 32630,
      declinationMode: 'manual',
      declinationDeg: -2,
    })
    .returning()
  const [other] = await db
    .insert(projects)
    .values({ code: 'OTH', name: 'Other project', crsEpsg: 32630 })
    .returning()
  for (const role of ['lead', 'engineer', 'logger', 'viewer'] as ProjectRole[]) {
    await db
      .insert(memberships)
      .values({ projectId: project.id, userId: userIds[role as Actor], role })
  }
  await db
    .insert(memberships)
    .values({ projectId: other.id, userId: userIds.outsider, role: 'lead' })
  const [hole] = await db.insert(holes).values(holeValues(project.id, 'TST-01')).returning()
  return {
    db,
    app,
    mail,
    projectId: project.id,
    otherProjectId: other.id,
    holeId: hole.id,
    userIds,
    close: () => pool.end(),
  }
}

export const holeValues = (projectId: number, name: string) => ({
  projectId,
  name,
  collarEast: 512000,
  collarNorth: 6012000,
  collarElevation: 200,
  plannedAzimuth: 0,
  plannedPlunge: 60,
  finalDepth: 100,
})

export async function wipe(db: Db) {
  const { rows } = await db.execute<{ tablename: string }>(
    sql`select tablename from pg_tables where schemaname = 'public'`,
  )
  const names = rows.map((r) => `"${r.tablename}"`).join(', ')
  await db.execute(sql.raw(`truncate ${names} restart identity cascade`))
}

/** A signed-in (or anonymous) client that sends the CSRF token on every request. */
export interface Client {
  get: (url: string) => request.Test
  post: (url: string, body?: object) => request.Test
  put: (url: string, body?: object) => request.Test
  patch: (url: string, body?: object) => request.Test
  delete: (url: string) => request.Test
  /** A POST with the CSRF header and no body yet: for multipart uploads (.field, .attach). */
  postMultipart: (url: string) => request.Test
  /** Uploads one file in the multipart field `file`. */
  upload: (url: string, bytes: Buffer, name: string) => request.Test
  csrf: string
}

export async function clientFor(app: Express, who: Actor | 'anonymous'): Promise<Client> {
  const agent = request.agent(app)
  let csrf = (await agent.get('/api/auth/csrf')).body.data.csrfToken as string
  if (who !== 'anonymous') {
    const res = await agent
      .post('/api/auth/login')
      .set('X-CSRF-Token', csrf)
      .send({ email: `${who}@test.example`, password: PASSWORD })
    if (res.status !== 200) throw new Error(`sign-in as ${who} failed: ${res.status}`)
    csrf = res.body.data.csrfToken
  }
  return {
    csrf,
    get: (url) => agent.get(url),
    post: (url, body = {}) => agent.post(url).set('X-CSRF-Token', csrf).send(body),
    put: (url, body = {}) => agent.put(url).set('X-CSRF-Token', csrf).send(body),
    patch: (url, body = {}) => agent.patch(url).set('X-CSRF-Token', csrf).send(body),
    delete: (url) => agent.delete(url).set('X-CSRF-Token', csrf),
    postMultipart: (url) => agent.post(url).set('X-CSRF-Token', csrf),
    upload: (url, bytes, name) =>
      agent.post(url).set('X-CSRF-Token', csrf).attach('file', bytes, name),
  }
}

/** Row count of a table, to prove a refused write changed nothing. */
export async function countRows(db: Db, table: string): Promise<number> {
  const { rows } = await db.execute<{ n: string }>(
    sql.raw(`select count(*)::text as n from "${table}"`),
  )
  return Number(rows[0].n)
}
