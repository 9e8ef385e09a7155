import { describe, expect, it } from 'vitest'
import { readFileSync } from 'node:fs'
import { fileURLToPath } from 'node:url'
import {
  depthsInMetres,
  lasSummary,
  readLas,
  type LasFile,
} from '../../backend/src/imports/las/index'

const dir = fileURLToPath(new URL('../../testdata/las/', import.meta.url))
const lasBytes = (name: string) => readFileSync(dir + name)
const values = (file: LasFile, m: string) => {
  const curve = file.curves.find((c) => c.mnemonic === m)
  if (!curve) throw new Error(`no curve ${m}`)
  return Array.from(curve.values, (v) => (Number.isNaN(v) ? null : v))
}
describe('readLas() valid files', () => {
  it('readLas() unwrapped LAS 2.0: header, curves, values and NULL → NaN', () => {
    const las = readLas(lasBytes('gsq-bh02-plain.las'))
    expect(las).toMatchObject({ version: '2.0', wrap: false, delimiter: 'SPACE', depthUnit: 'M' })
    expect(las).toMatchObject({ start: 10, stop: 12, step: 0.25, nullValue: -999.25 })
    expect(las.sampleCount).toBe(9)
    expect(las.well.WELL.value).toBe('GSQ-BH02')
    expect(las.well.COMP.value).toBe('GREYSCAR QUARRY LTD')
    expect(las.well.UWI).toMatchObject({ value: 'GSQ-BH02-L1', description: 'UNIQUE WELL ID' })
    expect(las.curves.map((c) => `${c.mnemonic}.${c.unit}`)).toEqual([
      'DEPT.M',
      'GR.GAPI',
      'DEN.G/CC',
      'RES.OHMM',
    ])
    expect(values(las, 'DEPT')).toEqual([10, 10.25, 10.5, 10.75, 11, 11.25, 11.5, 11.75, 12])
    expect(values(las, 'GR')).toEqual([45.2, 47.85, null, 52.1, 55, 61.35, 58.4, 50.05, 48.6])
    expect(values(las, 'DEN')[6]).toBeNull()
    expect(values(las, 'RES')[3]).toBeNull()
    expect(las.parameters.map((p) => [p.mnemonic, p.unit, p.value])).toEqual([
      ['BS', 'MM', '96.0'],
      ['EKB', 'M', '212.40'],
    ])
    expect(las.problems).toEqual([])
  })

  it('readLas() wrapped (WRAP YES): depth alone on its line, values over two lines', () => {
    const las = readLas(lasBytes('gsq-bh02-wrapped.las'))
    expect(las.wrap).toBe(true)
    expect(las.curves).toHaveLength(11)
    expect(values(las, 'DEPT')).toEqual([14, 14.2, 14.4, 14.6])
    expect(values(las, 'TEMP')).toEqual([11.84, 11.85, 11.86, 11.87])
    expect(values(las, 'PE')).toEqual([3.12, null, 3.18, 3.21])
    expect(values(las, 'NPHI')).toEqual([0.081, 0.079, 0.076, 0.074])
  })

  it('readLas() feet: FT index converted at 0.3048 m/ft; AZI/DEVI found as deviation', () => {
    const las = readLas(lasBytes('gsq-bh03-feet-deviation.las'))
    expect(las.depthUnit).toBe('FT')
    expect(las.metresPerDepthUnit).toBe(0.3048)
    expect(Array.from(depthsInMetres(las)).slice(0, 3)).toEqual([0, 1.524, 3.048])
    expect(Array.from(depthsInMetres(las, 0.5)).at(-1)).toBe(12.692)
    const summary = lasSummary(las)
    expect(summary.depthRange).toEqual({ from: 0, to: 12.192 })
    expect(summary.step).toBe(1.524)
    expect(summary.deviation).toEqual({ azimuthCurve: 'AZI', inclinationCurve: 'DEVI' })
    expect(summary.curves.find((c) => c.mnemonic === 'GR')).toEqual({
      mnemonic: 'GR',
      unit: 'GAPI',
      description: 'NATURAL GAMMA',
      nullCount: 1,
      min: 40.5,
      max: 48.3,
    })
  })

  it('readLas() punctuated titles, colons in values, hyphenated units, ~O text', () => {
    const las = readLas(lasBytes('gsq-bh04-punctuated.las'))
    expect(las.well.DATE).toMatchObject({
      value: '2024-03-15 12:30:00',
      description: 'Date and time logged',
    })
    expect(las.well.TIME.value).toBe('12:30:00')
    expect(las.curves.map((c) => c.unit)).toEqual(['M', 'OHM-M', 'OHM-M', 'KGF'])
    expect(las.parameters[0]).toMatchObject({ mnemonic: 'RMF', unit: 'OHM-M', value: '12.5' })
    expect(las.nullValue).toBe(-9999)
    expect(values(las, 'RLLD')).toEqual([150.2, null, 162.7])
    expect(las.other).toBe('Logged after flushing; fluid level 4.2 m below collar.')
  })

  it('readLas() single-space header lines and no ~P section', () => {
    const las = readLas(lasBytes('gsq-bh05-single-space.las'))
    expect(las).toMatchObject({ version: '2.0', start: 5, stop: 6, step: 0.5, nullValue: -999.25 })
    expect(las.well.WELL.value).toBe('GSQ-BH05')
    expect(las.parameters).toEqual([])
    expect(values(las, 'TT')).toEqual([61.2, null, 60.8])
    expect(las.problems).toEqual([])
  })

  it('readLas() LAS 3.0 comma-delimited: ~Log_* sections, {format} cut, ~Inclinometry_* read', () => {
    const las = readLas(lasBytes('gsq-bh06-las3-comma.las'))
    expect(las).toMatchObject({ version: '3.0', delimiter: 'COMMA', start: 30, stop: 31.5 })
    expect(las.well.TIME).toMatchObject({ value: '09:45', format: 'hh:mm' })
    expect(las.well.DATE).toMatchObject({ value: '15/03/2024', description: 'Log date' })
    expect(las.parameters[0]).toMatchObject({ mnemonic: 'BS', value: '96.0', format: 'F' })
    expect(values(las, 'DEN')).toEqual([2.66, null, 2.71, 2.69])
    expect(las.otherSections).toEqual([])
    expect(las.dataSets.map((d) => [d.name, d.kind, d.line, d.sampleCount])).toEqual([
      ['INCLINOMETRY', 'inclinometry', 25, 2],
    ])
    expect(Array.from(las.dataSets[0].curves[2].values)).toEqual([30.0, 30.4])
  })

  it('readLas() LAS 3.0 tab-delimited, STEP 0 (irregular), decreasing depths', () => {
    const text = [
      '~Version',
      'VERS. 3.0 : CWLS LAS 3.0',
      'WRAP. NO : one line per step',
      'DLM . TAB : tab',
      '~Well',
      'STRT .M 8.0 : first',
      'STOP .M 7.1 : last',
      'STEP .M 0 : irregular',
      'NULL . -999.25 : null',
      '~Log_Definition',
      'DEPT .M : depth',
      'GR .GAPI : gamma',
      '~Log_Data',
      '8.0\t40.0',
      '7.7\t-999.25',
      '7.1\t',
    ].join('\n')
    const las = readLas(text)
    expect(las).toMatchObject({ delimiter: 'TAB', step: 0 })
    expect(values(las, 'DEPT')).toEqual([8, 7.7, 7.1])
    expect(values(las, 'GR')).toEqual([40, null, null])
    expect(lasSummary(las).step).toBeNull()
    expect(las.problems).toEqual([{ line: null, message: '1 empty data fields read as NULL.' }])
  })

  it('readLas() Latin-1 bytes (° in a unit), CR-only line ends, a byte-order mark', () => {
    const text = lasBytes('gsq-bh05-single-space.las').toString('latin1')
    const latin = Buffer.from(text.replace('TT.US', 'TT.°C').replaceAll('\n', '\r'), 'latin1')
    const las = readLas(latin)
    expect(las.curves[2].unit).toBe('°C')
    expect(readLas(`\ufeff${text}`).well.WELL.value).toBe('GSQ-BH05')
    expect(values(las, 'AMP')).toEqual([812.5, 790.1, 805])
  })
})
