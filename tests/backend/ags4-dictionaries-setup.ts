import { afterAll, beforeAll, beforeEach, expect } from 'vitest'
import request from 'supertest'
import { agsDictionaries, auditEvents } from '../../schema/index'
import { actors, clientFor, createFixture, PASSWORD, type Client, type Fixture } from './fixture'
import { dictionaryFileName, dictionaryText } from './ags4-files'

export const dictionariesUrl = '/api/ags/dictionaries'
export const bytes = (text: string) => Buffer.from(text, 'latin1')
export const dictionaryUploadName = dictionaryFileName.split('/').pop()!

/**
 * The app with a client per role and no dictionary loaded before each test (nor audit events);
 * `load` uploads a dictionary file (our test subset of AGS 4.1.1 unless told) as `who`.
 */
export function dictionarySuite() {
  const ctx = {
    fx: undefined as unknown as Fixture,
    as: {} as Partial<Record<string, Client>>,
    load: (text = dictionaryText, who = 'admin') =>
      ctx.as[who]!.upload(dictionariesUrl, bytes(text), dictionaryUploadName),
    /** The administrator signed in on an agent that sends no CSRF token. */
    adminWithoutToken: async () => {
      const agent = request.agent(ctx.fx.app)
      const token = (await agent.get('/api/auth/csrf')).body.data.csrfToken as string
      const signIn = await agent
        .post('/api/auth/login')
        .set('X-CSRF-Token', token)
        .send({ email: 'admin@test.example', password: PASSWORD })
      expect(signIn.status).toBe(200)
      return agent
    },
  }
  beforeAll(async () => {
    ctx.fx = await createFixture({ UPLOAD_LIMIT_MB: '1' })
    for (const who of [...actors, 'anonymous'] as const)
      ctx.as[who] = await clientFor(ctx.fx.app, who)
  })
  beforeEach(async () => {
    await ctx.fx.db.delete(agsDictionaries)
    await ctx.fx.db.delete(auditEvents)
  })
  afterAll(async () => {
    await ctx.fx.close()
  })
  return ctx
}
