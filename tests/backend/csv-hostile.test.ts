import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { readFileSync } from 'node:fs'
import { clientFor, countRows, createFixture, type Client, type Fixture } from './fixture'

// Hostile or odd CSV input: RFC 4180 quoting across lines, text that is not UTF-8, binary bytes
// deep in a file, absurd widths. Each is refused naming the line, or read with a visible warning.
let fx: Fixture
let logger: Client
const url = () => `/api/projects/${fx.projectId}/holes/${fx.holeId}/imports`
const testdata = (name: string) =>
  readFileSync(new URL(`../../testdata/csv/${name}`, import.meta.url))
const upload = (file: Buffer, name: string) =>
  logger.postMultipart(url()).field('kind', 'structures').attach('file', file, name)

beforeAll(async () => {
  fx = await createFixture()
  logger = await clientFor(fx.app, 'logger')
})
afterAll(() => fx.close())

describe('POST …/imports with hostile CSV', () => {
  it('a NUL byte after the first 64 KB → 400 naming its line, nothing stored', async () => {
    const head = 'depth,type,alpha,beta\n'
    const rows = Array.from({ length: 6000 }, (_, i) => `${(10 + i * 0.01).toFixed(2)},joint,45,90`)
    rows[5000] = rows[5000].replace('45', '4\u00005')
    const file = Buffer.from(head + rows.join('\n') + '\n')
    expect(file.indexOf(0)).toBeGreaterThan(64 * 1024)
    const before = await countRows(fx.db, 'imports')
    const res = await upload(file, 'nul-late.csv')
    expect(res.status).toBe(400)
    expect(res.body.error.code).toBe('not_text')
    expect(res.body.error.details).toEqual([
      { path: 'file.line.5002', message: 'NUL byte (binary content)' },
    ])
    expect(await countRows(fx.db, 'imports')).toBe(before)
  })

  it('Latin-1 text is read as Windows-1252 with a warning in the preview (no U+FFFD stored)', async () => {
    const res = await upload(testdata('structures-latin1.csv'), 'structures-latin1.csv')
    expect(res.status).toBe(201)
    expect(res.body.data.encoding).toBe('windows-1252')
    expect(res.body.data.warnings).toEqual([
      'The file is not UTF-8 (first at line 2): it was read as Windows-1252 (Latin-1). Check accented text in the preview, or save the file as UTF-8.',
    ])
    const commit = await logger.post(`${url()}/${res.body.data.importId}/commit`, {})
    expect(commit.status).toBe(200)
    const list = await logger.get(`/api/projects/${fx.projectId}/holes/${fx.holeId}/structures`)
    const comments = list.body.data.map((s: { comment: string }) => s.comment)
    expect(comments).toEqual(expect.arrayContaining(['café seam', 'grès band']))
    expect(comments.join('')).not.toContain('\uFFFD')
  })

  it('a quoted cell over lines 2–4, then a bad value on line 5 → reported at line 5 (and a bad cell over lines 6–7 at line 6)', async () => {
    const res = await upload(testdata('structures-multiline-bad.csv'), 'multiline.csv')
    expect(res.status).toBe(422)
    const paths = res.body.error.details.map((d: { path: string }) => d.path)
    expect(paths).toEqual(['file.line.5.alpha', 'file.line.6.beta'])
    expect(res.body.error.details[0].message).toMatch(/^row 2 \(line 5\), column alpha: /)
  })

  it('a CSV with 200,000 columns → 400 too_many_columns at line 1, the headers not echoed', async () => {
    const headers = Array.from({ length: 200_000 }, (_, i) => `c${i}`)
    const file = Buffer.from(`${headers.join(',')}\n${headers.map(() => '1').join(',')}\n`)
    const res = await upload(file, 'wide.csv')
    expect(res.status).toBe(400)
    expect(res.body.error.code).toBe('too_many_columns')
    expect(res.body.error.details).toEqual([
      { path: 'file.line.1', message: '200000 columns (at most 500)' },
    ])
    expect(JSON.stringify(res.body).length).toBeLessThan(2000)
  })
})
