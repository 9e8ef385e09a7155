import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { actors, clientFor, createFixture, type Client, type Fixture } from './fixture'
import { edit, readAgs, site, swapColumns } from './ags4-files'

// POST /api/ags/validate: any signed-in user checks any AGS4 file; nothing is stored. No
// dictionary is loaded here (the built-in groups); ags4-dictionaries-route.test.ts loads one.
let fx: Fixture
const as: Partial<Record<string, Client>> = {}
const url = '/api/ags/validate'
const bytes = (text: string) => Buffer.from(text, 'latin1')

beforeAll(async () => {
  fx = await createFixture({ UPLOAD_LIMIT_MB: '1' })
  for (const who of [...actors, 'anonymous'] as const) as[who] = await clientFor(fx.app, who)
})
afterAll(async () => {
  await fx.close()
})

describe('POST /api/ags/validate', () => {
  it('POST /api/ags/validate → 401 signed out (before the upload is read), 403 without the CSRF token', async () => {
    const res = await as.anonymous!.upload(url, bytes(site), 'site.ags')
    expect(res.status).toBe(401)
    const agent = request(fx.app)
    expect((await agent.post(url).attach('file', bytes(site), 'site.ags')).status).toBe(403)
  })

  it('POST /api/ags/validate → 200 for every signed-in user, members of no project too', async () => {
    for (const who of actors) {
      const res = await as[who]!.upload(url, bytes(site), 'site.ags')
      expect(res.status, who).toBe(200)
      expect(res.body.data).toMatchObject({
        fileName: 'site.ags',
        errors: 0,
        warnings: 0,
        edition: '4.1.1',
        dictionary: { edition: '4.1.1', source: 'built-in' },
      })
      // no dictionary is loaded here: the groups beyond Downdip's are listed, not passed
      expect(res.body.data.unchecked).toHaveLength(10)
    }
  })

  it('POST /api/ags/validate → 400 naming the field: no file, an empty file, an extra field', async () => {
    const none = await as.viewer!.postMultipart(url).field('note', 'x')
    expect(none.status).toBe(400)
    expect(none.body.error.details).toEqual([{ path: 'file', message: 'required' }])
    const empty = await as.viewer!.upload(url, Buffer.alloc(0), 'empty.ags')
    expect(empty.status).toBe(400)
    expect(empty.body.error.details).toEqual([{ path: 'file', message: 'The file is empty.' }])
    const extra = await as
      .viewer!.postMultipart(url)
      .field('mode', 'strict')
      .attach('file', bytes(site), 'site.ags')
    expect(extra.status).toBe(400)
    expect(extra.body.error.details[0].path).toBe('body')
  })

  it('POST /api/ags/validate → 413 over the upload limit', async () => {
    const big = Buffer.alloc(1024 * 1024 + 1, 0x20)
    const res = await as.viewer!.upload(url, big, 'big.ags')
    expect(res.status).toBe(413)
  })

  it('POST /api/ags/validate → the findings of a broken file by rule and line, with counts', async () => {
    const broken = edit(
      swapColumns(site, 'LOCA', 'LOCA_GREF', 'LOCA_GL'),
      '"4.1.1","Greyscar Aggregates"',
      '"4.1.1",""',
    )
    const res = await as.viewer!.upload(url, bytes(broken), 'from-others.ags')
    expect(res.status).toBe(200)
    expect(res.body.data).toMatchObject({
      errors: 2,
      warnings: 0,
      truncated: false,
      byRule: [
        { rule: '7', errors: 1, warnings: 0 },
        { rule: '10b', errors: 1, warnings: 0 },
      ],
      findings: [
        {
          line: 11,
          rule: '10b',
          severity: 'error',
          message: 'Rule 10b: REQUIRED field TRAN_RECV is empty',
        },
        {
          line: 53,
          rule: '7',
          severity: 'error',
          message:
            'Rule 7: LOCA_GREF comes after LOCA_GL; the dictionary order is LOCA_ID, LOCA_TYPE, LOCA_NATE, LOCA_NATN, LOCA_GREF, LOCA_GL, LOCA_FDEP',
        },
      ],
    })
  })

  it('POST /api/ags/validate → a file that is not UTF-8 is read byte by byte and its bytes found (Rule 1)', async () => {
    const latin = Buffer.concat([
      bytes(site).subarray(0, 30),
      Buffer.from([0xe9]),
      bytes(site).subarray(30),
    ])
    const res = await as.viewer!.upload(url, latin, 'latin.ags')
    expect(res.body.data.findings[0]).toMatchObject({ line: 2, rule: '1' })
    expect(res.body.data.notes[0]).toMatch(/^The file is not valid UTF-8/)
  })

  it('POST /api/ags/validate → findings capped at 1000, counts over the whole file', async () => {
    const lf = readAgs('gsq-monitoring.ags').replace(/\r\n/g, '\n').repeat(10)
    const res = await as.viewer!.upload(url, bytes(lf), 'lf.ags')
    expect(res.body.data.findings).toHaveLength(1000)
    expect(res.body.data.truncated).toBe(true)
    expect(res.body.data.byRule.find((r: { rule: string }) => r.rule === '2a').errors).toBe(
      lf.split('\n').length - 1,
    )
  })
})
