import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { clientFor, countRows, createFixture, type Client, type Fixture } from './fixture'

// A client that lost an answer retries with the same Idempotency-Key: one row is stored and the
// same body answered (IETF draft "The Idempotency-Key HTTP Header Field", common practice).
let fx: Fixture
let logger: Client
let engineer: Client
const hole = () => `/api/projects/${fx.projectId}/holes/${fx.holeId}`
const structure = { depth: 20.5, type: 'joint', alpha: 45, beta: 120 }

beforeAll(async () => {
  fx = await createFixture()
  logger = await clientFor(fx.app, 'logger')
  engineer = await clientFor(fx.app, 'engineer')
})
afterAll(() => fx.close())

describe('Idempotency-Key on POST structures and runs', () => {
  it('POST structures twice with one key → one row, the same 201 body, the retry marked replayed', async () => {
    const before = await countRows(fx.db, 'structures')
    const key = 'c0ffee00-0000-4000-8000-000000000001'
    const first = await logger.post(`${hole()}/structures`, structure).set('Idempotency-Key', key)
    const again = await logger.post(`${hole()}/structures`, structure).set('Idempotency-Key', key)
    expect(first.status).toBe(201)
    expect(again.status).toBe(201)
    expect(again.body).toEqual(first.body)
    expect(again.headers['idempotent-replayed']).toBe('true')
    expect(await countRows(fx.db, 'structures')).toBe(before + 1)
  })

  it('POST structures with one key sent twice at once → one row, both answers alike', async () => {
    const before = await countRows(fx.db, 'structures')
    const key = 'c0ffee00-0000-4000-8000-000000000002'
    const body = { ...structure, depth: 21.25 }
    const [a, b] = await Promise.all([
      logger.post(`${hole()}/structures`, body).set('Idempotency-Key', key),
      logger.post(`${hole()}/structures`, body).set('Idempotency-Key', key),
    ])
    expect([a.status, b.status]).toEqual([201, 201])
    expect(a.body.data.id).toBe(b.body.data.id)
    expect(await countRows(fx.db, 'structures')).toBe(before + 1)
  })

  it('POST structures: the same key with another body → 422 naming the header, nothing stored', async () => {
    const key = 'c0ffee00-0000-4000-8000-000000000003'
    await logger
      .post(`${hole()}/structures`, { ...structure, depth: 22 })
      .set('Idempotency-Key', key)
    const before = await countRows(fx.db, 'structures')
    const res = await logger
      .post(`${hole()}/structures`, { ...structure, depth: 23 })
      .set('Idempotency-Key', key)
    expect(res.status).toBe(422)
    expect(res.body.error.code).toBe('idempotency_key_reused')
    expect(res.body.error.details[0].path).toBe('header.idempotency-key')
    expect(await countRows(fx.db, 'structures')).toBe(before)
  })

  it('keys belong to their user: another user with the same key stores a row of their own', async () => {
    const key = 'c0ffee00-0000-4000-8000-000000000004'
    const body = { ...structure, depth: 24 }
    const a = await logger.post(`${hole()}/structures`, body).set('Idempotency-Key', key)
    const b = await engineer.post(`${hole()}/structures`, body).set('Idempotency-Key', key)
    expect(a.status).toBe(201)
    expect(b.status).toBe(201)
    expect(b.body.data.id).not.toBe(a.body.data.id)
  })

  it('POST runs twice with one key → one run, the same body', async () => {
    const before = await countRows(fx.db, 'core_runs')
    const key = 'c0ffee00-0000-4000-8000-000000000005'
    const run = { fromDepth: 30, toDepth: 33, recovered: 2.9, solid: 2.5, rqdLength: 2.1 }
    const first = await logger.post(`${hole()}/runs`, run).set('Idempotency-Key', key)
    const again = await logger.post(`${hole()}/runs`, run).set('Idempotency-Key', key)
    expect(first.status).toBe(201)
    expect(again.body).toEqual(first.body)
    expect(await countRows(fx.db, 'core_runs')).toBe(before + 1)
  })

  it('a malformed Idempotency-Key → 400 naming the header; a viewer is still refused (403)', async () => {
    const res = await logger
      .post(`${hole()}/structures`, { ...structure, depth: 26 })
      .set('Idempotency-Key', 'short')
    expect(res.status).toBe(400)
    expect(res.body.error.details[0].path).toBe('header.idempotency-key')
    const viewer = await clientFor(fx.app, 'viewer')
    const refused = await viewer
      .post(`${hole()}/structures`, { ...structure, depth: 27 })
      .set('Idempotency-Key', 'c0ffee00-0000-4000-8000-000000000006')
    expect(refused.status).toBe(403)
  })
})
