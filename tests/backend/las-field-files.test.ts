import { describe, expect, it } from 'vitest'
import { readFileSync } from 'node:fs'
import { fileURLToPath } from 'node:url'
import {
  curvesToStore,
  deviationSurvey,
  lasSummary,
  readLas,
  type LasFile,
} from '../../backend/src/imports/las/index'
import { splitHeaderLine } from '../../backend/src/imports/las/header-line'
import { utf16Order } from '../../backend/src/imports/las/text'

// LAS files as they arrive from the field (STANDARDS.md "Files in the field", common practice):
// mixed line ends, LAS 1.2, UTF-16 and Windows-1252 text, units holding a colon. Each file in
// testdata/las/ was written for these tests.
const dir = fileURLToPath(new URL('../../testdata/las/', import.meta.url))
const read = (name: string) => readLas(readFileSync(dir + name))
const values = (file: LasFile, m: string) =>
  Array.from(file.curves.find((c) => c.mnemonic === m)!.values, (v) => (Number.isNaN(v) ? null : v))

describe('readLas() line ends: CRLF, LF and a bare CR each end one line', () => {
  it('a CRLF file with bare-CR lines in ~W keeps STRT, STOP, STEP and NULL apart; −999.25 is NULL', () => {
    const las = read('gsq-bh01-mixed-line-ends.las')
    expect(las).toMatchObject({ start: 20, stop: 21, step: 0.25, nullValue: -999.25 })
    expect(las.well.WELL.value).toBe('GSQ-BH01')
    expect(values(las, 'DEPT')).toEqual([20, 20.25, 20.5, 20.75, 21])
    // the NULL sample is no value, not a gamma ray of −999.25
    expect(values(las, 'GR')).toEqual([51.2, null, 49.8, 48.0, 50.1])
  })

  it('line numbers count a bare CR as a line end', () => {
    const text =
      '~V\r VERS. 2.0 :\r WRAP. NO :\r~W\r STRT.M 1 :\r STOP.M 2 :\r STEP.M 1 :\r NULL. -999.25 :\r~C\r DEPT.M :\r~A\r1\rx\r'
    expect(() => readLas(text)).toThrow(/Line 13/)
  })
})

describe('readLas() LAS 1.2 (CWLS 1.2: the 2.0 sections and line syntax, fewer required items)', () => {
  it('is read like 2.0 with a notice; its ~W text items (label before the colon) are swapped back', () => {
    const las = read('gsq-bh03-las12.las')
    expect(las.version).toBe('1.2')
    expect(las).toMatchObject({ start: 30, stop: 31, step: 0.5, nullValue: -999.25 })
    expect(las.well.COMP.value).toBe('GREYSCAR QUARRY LTD')
    expect(las.well.WELL).toMatchObject({ value: 'GSQ-BH03', description: 'WELL' })
    expect(las.well.FLD.value).toBe('NORTH WALL EXTENSION')
    expect(las.well.DATE.value).toBe('12-MAY-2025')
    expect(values(las, 'GR')).toEqual([61.5, null, 58.25])
    expect(las.problems.some((p) => /LAS 1\.2/.test(p.message))).toBe(true)
  })

  it('a 1.2 file written the 2.0 way keeps its values', () => {
    const text = readFileSync(dir + 'gsq-bh02-plain.las', 'utf8').replace(
      /VERS\.\s+2\.0/,
      'VERS. 1.2',
    )
    const las = readLas(text)
    expect(las.version).toBe('1.2')
    expect(las.well.WELL.value).toBe('GSQ-BH02')
    expect(las.well.COMP.value).toBe('GREYSCAR QUARRY LTD')
  })
})

describe('readLas() text encodings [common practice: UTF-8, Windows-1252, UTF-16 in the field]', () => {
  it('UTF-16LE with a byte-order mark and UTF-16BE without one read as text, with a notice', () => {
    for (const [name, order] of [
      ['gsq-bh04-utf16le-bom.las', 'UTF-16LE'],
      ['gsq-bh04-utf16be.las', 'UTF-16BE'],
    ] as const) {
      const las = read(name)
      expect(las.well.WELL.value, name).toBe('GSQ-BH04')
      expect(las.curves[1].description).toBe('INCLINATION FROM VERTICAL (°)')
      expect(values(las, 'DEVI')).toEqual([31.5, 31.6, null])
      expect(las.problems[0].message).toContain(order)
    }
  })

  it('Windows-1252 bytes (° as 0xB0, µ as 0xB5) read with a notice', () => {
    const las = read('gsq-bh04-windows-1252.las')
    expect(las.curves[1].description).toBe('INCLINATION FROM VERTICAL (°), SPACING 5 µs')
    expect(las.problems[0].message).toMatch(/Windows-1252/)
  })

  it('UTF-16 is told from ASCII by its zero bytes; plain ASCII and UTF-8 are not UTF-16', () => {
    expect(utf16Order(new Uint8Array(Buffer.from('~V\r\n VERS. 2.0 :', 'utf16le')))).toBe(
      'utf-16le',
    )
    expect(utf16Order(new Uint8Array(Buffer.from('~V\r\n VERS. 2.0 : ° µ', 'utf8')))).toBeNull()
  })

  it('a NUL in 8-bit text is still binary data, named by its line', () => {
    expect(() => read('broken-binary.las')).toThrow(/Line 3: .*NUL/)
  })
})

describe('header lines: the unit ends at the first blank after the first dot (CWLS LAS 2.0)', () => {
  it('TLOG.hh:mm keeps its unit hh:mm and the value 14:35; DEPT.M: still splits at the colon', () => {
    const las = read('gsq-bh06-colon-unit.las')
    expect(las.parameters[0]).toMatchObject({
      mnemonic: 'TLOG',
      unit: 'hh:mm',
      value: '14:35',
      description: 'TIME LOGGER REACHED BOTTOM',
    })
    expect(las.curves[0]).toMatchObject({ mnemonic: 'DEPT', unit: 'M', description: 'DEPTH' })
    expect(splitHeaderLine('DATE.  2024-03-15 12:30:00 : LOG DATE', 1, false)).toMatchObject({
      unit: '',
      value: '2024-03-15 12:30:00',
    })
  })
})

describe('readLas() LAS 3.0 data sets, text columns and quoted values (CWLS LAS 3.0)', () => {
  it('a {S} column is read as text; a quoted value keeps the delimiter and doubled quotes', () => {
    const las = read('gsq-bh05-las3-sets.las')
    const lith = las.curves.find((c) => c.mnemonic === 'LITH')!
    expect(lith.text).toEqual(['MDST, grey', 'LMST', 'MDST, dark grey, "fissile"'])
    expect(values(las, 'GR')).toEqual([41.5, null, 44.8])
  })

  it('every set is read: cores (two data sections, a date column), inclinometry, a second log', () => {
    const las = read('gsq-bh05-las3-sets.las')
    expect(las.dataSets.map((d) => [d.name, d.kind, d.line, d.sampleCount])).toEqual([
      ['CORE [1]', 'other', 19, 1],
      ['CORE [2]', 'other', 19, 1],
      ['INCLINOMETRY', 'inclinometry', 27, 3],
      ['LOG (2)', 'log', 35, 2],
    ])
    expect(las.dataSets[1].curves[2].text).toEqual(['05/03/2025'])
    expect(Array.from(las.dataSets[2].curves[1].values)).toEqual([190, 190.5, 191])
    expect(Array.from(las.dataSets[3].curves[1].values)).toEqual([61.2, 60.8])
    expect(las.otherSections).toEqual([])
  })

  it('the inclinometry set is the survey source when the log has no deviation channels', () => {
    const las = read('gsq-bh05-las3-sets.las')
    expect(lasSummary(las).deviation).toEqual({ azimuthCurve: 'AZIM', inclinationCurve: 'INCL' })
    const survey = deviationSurvey(las, 30, 0)!
    expect(survey.stations.map((s) => [s.depth, s.azimuth, s.plunge])).toEqual([
      [0, 190, 60],
      [30, 190.5, 59.8],
      [60, 191, 59.4],
    ])
  })

  it('text columns are kept in the preview, never stored as curves', () => {
    const las = read('gsq-bh05-las3-sets.las')
    const summary = lasSummary(las)
    expect(summary.curves.find((c) => c.mnemonic === 'LITH')).toMatchObject({ text: true })
    const choice = curvesToStore(las, ['GR', 'LITH'], 0)
    expect(choice.curves.map((c) => c.mnemonic)).toEqual(['GR'])
    expect(choice.unknown).toEqual([
      { position: 1, message: 'A text column: kept in the file, not stored as a curve.' },
    ])
  })
})

describe('readLas() decimal commas: read where the comma is not the delimiter, refused where ambiguous', () => {
  it('DLM SPACE with 70,5 and -999,25 in ~W and ~A → 70.5, NULL honoured, with a notice', () => {
    const las = read('gsq-bh02-decimal-comma.las')
    expect(las).toMatchObject({ start: 70, stop: 71, step: 0.5, nullValue: -999.25 })
    expect(values(las, 'DEPT')).toEqual([70, 70.5, 71])
    expect(values(las, 'DEN')).toEqual([2.65, null, 2.71])
    expect(las.problems.map((p) => p.message)).toContain(
      'Decimal commas read as decimal marks (12,5 = 12.5).',
    )
  })

  it('decimal commas and decimal points in one file → refused at the line that disagrees', () => {
    expect(() => read('broken-decimal-mixed.las')).toThrow(
      /^Line 17: Decimal commas \(line 15\) and decimal points \(line 17\)/,
    )
  })

  it('DLM COMMA: a comma is the delimiter, so 2,65 is two values (a column-count refusal)', () => {
    const text = readFileSync(dir + 'gsq-bh02-decimal-comma.las', 'utf8')
      .replace('DLM .   SPACE', 'DLM .   COMMA')
      .replace('70,0 2,65', '70.0,2.65,1')
    expect(() => readLas(text)).toThrow(/Line 15: This line has 3 values/)
  })
})

describe('readLas() stays linear on hostile quoting and never refuses a file for a broken side set', () => {
  it('a 2 MB run of quotes and delimiters in one data line is refused by line in under a second', () => {
    const text = readFileSync(dir + 'gsq-bh05-las3-sets.las', 'utf8').replace(
      '60.5,-999.25,LMST',
      `60.5,${'","'.repeat(700_000)}`,
    )
    const t0 = performance.now()
    expect(() => readLas(text)).toThrow(/^Line 17: /)
    expect(performance.now() - t0).toBeLessThan(1000)
  })

  it('a side set with text in a number column is noted with its line; the log is still read', () => {
    const text = readFileSync(dir + 'gsq-bh05-las3-sets.las', 'utf8').replace(
      '30.0,190.5,30.2',
      '30.0,n/a,30.2',
    )
    const las = readLas(text)
    expect(las.sampleCount).toBe(3)
    expect(las.dataSets.map((d) => d.name)).not.toContain('INCLINOMETRY')
    expect(las.problems).toContainEqual({
      line: 33,
      message: 'Data set INCLINOMETRY not read: Text in the data: "n/a" is not a number.',
    })
  })
})
