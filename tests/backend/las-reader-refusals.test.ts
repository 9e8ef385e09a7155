import { describe, expect, it } from 'vitest'
import { readFileSync } from 'node:fs'
import { fileURLToPath } from 'node:url'
import { LasReadError, readLas } from '../../backend/src/imports/las/index'

const dir = fileURLToPath(new URL('../../testdata/las/', import.meta.url))
const lasBytes = (name: string) => readFileSync(dir + name)
/** Runs `fn`, expects a LasReadError, returns it with the time taken. */
function refused(fn: () => unknown): { err: LasReadError; ms: number } {
  const t0 = performance.now()
  try {
    fn()
  } catch (err: unknown) {
    const ms = performance.now() - t0
    if (err instanceof LasReadError) return { err, ms }
    throw err
  }
  throw new Error('expected the file to be refused')
}

describe('readLas() refused files: the line number and the reason, each in under a second', () => {
  const cases: [string, number, RegExp][] = [
    ['broken-no-ascii.las', 12, /No ~A/],
    ['broken-curve-count.las', 16, /3 values; the ~C section defines 4 curves/],
    ['broken-text-in-data.las', 16, /"n\/a" is not a number/],
    ['broken-truncated.las', 18, /2 values.*cut short/],
    ['broken-version.las', 2, /VERS is "4.2"/],
    ['broken-binary.las', 3, /binary/],
    ['broken-no-version-first.las', 1, /first section must be ~V/],
  ]
  it.each(cases)('readLas(%s) → refused at line %i', (name, line, reason) => {
    const { err, ms } = refused(() => readLas(lasBytes(name)))
    expect(err.line).toBe(line)
    expect(err.issues[0].message).toMatch(reason)
    expect(ms).toBeLessThan(1000)
  })

  it('readLas() control-byte junk without NUL → refused as binary', () => {
    const junk = Buffer.alloc(400, 0x01)
    const { err } = refused(() =>
      readLas(Buffer.concat([Buffer.from('~V\nVERS. 2.0 : v\n'), junk])),
    )
    expect(err.line).toBe(3)
    expect(err.issues[0].message).toMatch(/control bytes/)
  })

  it('readLas() NULL depth, depth going back, wrapped depth not alone → each line named', () => {
    const head =
      '~V\nVERS. 2.0 : v\nWRAP. NO : w\n~W\nNULL. -999.25 : n\n~C\nDEPT.M : d\nGR.GAPI : g\n~A\n'
    expect(refused(() => readLas(head + '1 2\n-999.25 3\n')).err.issues).toEqual([
      { line: 11, message: 'The depth of this sample is the NULL value.' },
    ])
    expect(refused(() => readLas(head + '1 2\n2 3\n1.5 4\n')).err.line).toBe(12)
    const wrapped = head.replace('WRAP. NO', 'WRAP. YES')
    expect(refused(() => readLas(wrapped + '1 2\n')).err.issues[0].message).toMatch(/alone/)
    expect(refused(() => readLas(wrapped + '1\n2\n3\n')).err.issues[0]).toEqual({
      line: 12,
      message: 'The sample starting at line 12 ends after 1 of 2 values: the file seems cut short.',
    })
  })

  it('readLas() time-indexed log → refused: only depth logs', () => {
    const text = '~V\nVERS. 2.0 : v\nWRAP. NO : w\n~C\nTIME.S : t\nGR.GAPI : g\n~A\n1 2\n'
    expect(refused(() => readLas(text)).err.issues[0]).toEqual({
      line: 5,
      message: 'The index TIME is in "S": only depth logs (M, F, FT) are read.',
    })
  })
})

describe('readLas() hostile input stays linear', () => {
  const body = '\n DEPT.M : depth\n GR.GAPI : gamma\n~A\n1 2\n2 3\n'
  const head = '~Version Information\n VERS. 2.0 : v\n WRAP. NO : w\n'
  it.each([
    ['the catastrophic las-js title', `~Curve Information ${'-'.repeat(40)}(`],
    ['a title of 5,000 words', `~Curve${' Information'.repeat(5000)} -(`],
    ['a 200,000-character word', `~Curve_${'x'.repeat(200_000)}-(`],
  ])('readLas() %s → read in under a second', (_what, title) => {
    const t0 = performance.now()
    const las = readLas(head + title + body)
    expect(performance.now() - t0).toBeLessThan(1000)
    expect(las.curves.map((c) => c.mnemonic)).toEqual(['DEPT', 'GR'])
  })

  it('readLas() 10,000 undotted ~W lines → the first 100 warnings listed, the rest counted', () => {
    const las = readLas(`${head}~W\n${'x : y\n'.repeat(10_000)}~C${body}`)
    expect(las.problems).toHaveLength(101)
    expect(las.problems[0]).toEqual({
      line: 5,
      message: 'Skipped a header line without the MNEM.UNIT form.',
    })
    // 10,000 skipped lines + no NULL + no STRT/STOP − 100 listed
    expect(las.problems[100].message).toBe('9902 more warnings not listed.')
  })

  it('readLas() 1,000,000 ~W lines or 5,000 sections → refused in under a second', () => {
    const t0 = performance.now()
    const lines = refused(() => readLas(`${head}~W\n${'X.M 1 : y\n'.repeat(1_000_000)}~C${body}`))
    expect(lines.err.issues[0]).toEqual({
      line: 20_005,
      message: 'The ~W section has over 20000 lines.',
    })
    const sections = refused(() => readLas(`${head}${'~Z\n'.repeat(5000)}~C${body}`))
    expect(sections.err.issues[0]).toEqual({ line: 1003, message: 'More than 1000 sections.' })
    expect(performance.now() - t0).toBeLessThan(1000)
  })
})
