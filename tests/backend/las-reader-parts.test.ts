import { describe, expect, it } from 'vitest'
import { splitHeaderLine } from '../../backend/src/imports/las/header-line'
import { sectionKind } from '../../backend/src/imports/las/sections'
import { parseDecimal } from '../../backend/src/imports/las/tokenize'
import {
  detectDeviation,
  float8ArrayLiteral,
  readLas,
  stationsFromDeviation,
  storedSamples,
} from '../../backend/src/imports/las/index'

describe('splitHeaderLine(): first dot, first blank after it, last colon (CWLS LAS 2.0)', () => {
  it.each([
    [' STRT.M          10.0000 : START DEPTH', ['STRT', 'M', '10.0000', 'START DEPTH']],
    ['STRT.M 5.0 : START DEPTH', ['STRT', 'M', '5.0', 'START DEPTH']],
    [' NULL.  -999.25 : NULL VALUE', ['NULL', '', '-999.25', 'NULL VALUE']],
    [' TIME.      12:30:00 : Time', ['TIME', '', '12:30:00', 'Time']],
    [' RLLD.OHM-M   : Deep resistivity', ['RLLD', 'OHM-M', '', 'Deep resistivity']],
    [' DEPT..1IN    : Depth', ['DEPT', '.1IN', '', 'Depth']],
    ['DEPT.M: depth', ['DEPT', 'M', '', 'depth']],
    [' COMP. Greyscar Quarry Ltd', ['COMP', '', 'Greyscar Quarry Ltd', '']],
  ])('splitHeaderLine(%j)', (line, [mnemonic, unit, value, description]) => {
    expect(splitHeaderLine(line, 7, false)).toEqual({
      mnemonic,
      unit,
      value,
      description,
      format: '',
      line: 7,
    })
  })

  it('splitHeaderLine() LAS 3.0: {format} with colons and | association cut before the colon', () => {
    expect(splitHeaderLine('TIME . 09:45 : Log time {hh:mm} | Run_1', 3, true)).toMatchObject({
      mnemonic: 'TIME',
      value: '09:45',
      description: 'Log time',
      format: 'hh:mm',
    })
  })

  it('splitHeaderLine() without a dot → null', () => {
    expect(splitHeaderLine('just words : here', 1, false)).toBeNull()
  })
})

describe('sectionKind(): LAS 2.0 reads the letter, LAS 3.0 the name', () => {
  it.each([
    ['Curve Information (v2) - resistivity', false, 'C'],
    ['ASCII Log Data - depth', false, 'A'],
    ['Inclinometry_Data', false, 'other'],
    ['Log_Definition', true, 'C'],
    ['Log_Data | Log_Definition', true, 'A'],
    ['Core_Data | Core_Definition', true, 'other'],
  ] as const)('sectionKind(%j, v3 %s) → %s', (title, v3, kind) => {
    expect(sectionKind(title, v3)).toBe(kind)
  })
})

describe('parseDecimal(): the same double as Number(), NaN for text', () => {
  const text = '45.2 -999.25 0.081 .5 -0 1e3 1.5E-2 12345678901234567 2.650 n/a 1e 1.2.3 - 1e400'
  const tokens = text.split(' ')
  it.each(tokens.slice(0, 9))('parseDecimal(%s) === Number()', (token) => {
    expect(Object.is(parseDecimal(token, 0, token.length), Number(token))).toBe(true)
  })
  it.each(tokens.slice(9))('parseDecimal(%s) → NaN', (token) => {
    expect(parseDecimal(token, 0, token.length)).toBeNaN()
  })
})

describe('storedSamples(): arrays for one log_curves row', () => {
  it('storedSamples() drops leading/trailing absent samples, keeps inner nulls, sorts by depth', () => {
    const depths = Float64Array.from([5, 4, 3, 2, 1])
    const values = Float64Array.from([NaN, 10, NaN, 12, NaN])
    expect(storedSamples(depths, values)).toEqual({
      depths: [2, 3, 4],
      values: [12, null, 10],
      minDepth: 2,
      maxDepth: 4,
    })
    expect(storedSamples(depths, new Float64Array(5).fill(NaN))).toBeNull()
  })

  it('float8ArrayLiteral() → PostgreSQL array text with NULL', () => {
    expect(float8ArrayLiteral([1.5, null, -999.25, 1e-7])).toBe('{1.5,NULL,-999.25,1e-7}')
  })
})

describe('detectDeviation() and stationsFromDeviation()', () => {
  const las = (curves: string) =>
    readLas(`~V\nVERS. 2.0 : v\nWRAP. NO : w\n~C\nDEPT.M : d\n${curves}\n~A\n0 1 2\n`)

  it('detectDeviation() needs both channels in degrees; others are warnings', () => {
    const problems: { line: number | null; message: string }[] = []
    expect(detectDeviation(las('HAZI.DEG : a\nINCL.DEG : i').curves, problems)).toEqual({
      azimuthCurve: 'HAZI',
      inclinationCurve: 'INCL',
    })
    expect(detectDeviation(las('AZIM.RAD : a\nDEV.DEG : i').curves, problems)).toBeNull()
    expect(problems.map((p) => p.message)).toEqual([
      'AZIM looks like hole azimuth but its unit "RAD" is not degrees.',
      'DEV found without its partner channel: no deviation survey.',
    ])
  })

  it('stationsFromDeviation() nearest sample to each multiple of the interval; plunge = 90 − inclination', () => {
    const depths = Float64Array.from([0, 1.6, 2.9, 4.6, 6.1])
    const azimuth = Float64Array.from([355, 358, NaN, 2, 365])
    const inclination = Float64Array.from([30, 30.5, 31, 31.5, 32])
    expect(stationsFromDeviation(depths, azimuth, inclination, 3)).toEqual([
      { depth: 0, azimuth: 355, inclination: 30, plunge: 60 },
      { depth: 1.6, azimuth: 358, inclination: 30.5, plunge: 59.5 },
      { depth: 6.1, azimuth: 5, inclination: 32, plunge: 58 },
    ])
  })
})
