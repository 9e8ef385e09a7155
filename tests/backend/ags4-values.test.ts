import { describe, expect, it } from 'vitest'
import { knownTypes, valueFits } from '../../backend/src/exports/ags4-values'

// AGS4 data types as the 4.1.1 dictionary lists them (DICT_DTYP abbreviations): nDP "required
// number of decimal places", nSF "significant figures", nSCI "scientific notation; decimal
// places", DT in the format of the UNIT row, T elapsed time, YN, U, DMS.
const ok = (value: string, type: string, unit = '') => valueFits(value, type, unit) === undefined

describe('valueFits()', () => {
  it('valueFits() nDP: exactly n decimals (10.40 passes 2DP, 10.4 does not); 0DP whole numbers', () => {
    expect(['10.40', '-0.05', '0.00'].map((v) => ok(v, '2DP'))).toEqual([true, true, true])
    expect(['10.4', '10.400', '10', '1e1', ' 10.40'].map((v) => ok(v, '2DP'))).toEqual([
      false,
      false,
      false,
      false,
      false,
    ])
    expect([ok('17', '0DP'), ok('17.0', '0DP'), ok('-3', '0DP')]).toEqual([true, false, true])
  })

  it('valueFits() nSF: significant figures, zeros of a whole number optional', () => {
    expect(['6.4', '0.024', '23', '100', '0.0'].map((v) => ok(v, '2SF'))).toEqual([
      true,
      true,
      true,
      true,
      true,
    ])
    expect(['6.43', '6', '0.0240', '1234'].map((v) => ok(v, '2SF'))).toEqual([
      false,
      false,
      false,
      false,
    ])
    expect([ok('0.0630', '3SF'), ok('20.0', '3SF'), ok('20', '3SF')]).toEqual([true, true, false])
  })

  it('valueFits() nSCI: one digit, n decimals, exponent (5.1E-9 is 1SCI, 6.80E-6 is 2SCI)', () => {
    expect([ok('5.1E-9', '1SCI'), ok('6.80E-6', '2SCI'), ok('1.33E1', '2SCI')]).toEqual([
      true,
      true,
      true,
    ])
    expect([ok('5.10E-9', '1SCI'), ok('0.0000051', '1SCI'), ok('51E-10', '1SCI')]).toEqual([
      false,
      false,
      false,
    ])
  })

  it('valueFits() DT: the UNIT row pattern, months 1-12, hours 0-23; no UNIT, no check possible', () => {
    expect(ok('2026-11-03', 'DT', 'yyyy-mm-dd')).toBe(true)
    expect(ok('2026-11-03T23:59', 'DT', 'yyyy-mm-ddThh:mm')).toBe(true)
    expect(ok('2026-02-30', 'DT', 'yyyy-mm-dd')).toBe(true) // day checked to 31 only
    expect(valueFits('2026-11-03T24:00', 'DT', 'yyyy-mm-ddThh:mm')).toBe(
      '"2026-11-03T24:00" is not a valid date and time in "yyyy-mm-ddThh:mm"',
    )
    expect(ok('03/11/2026', 'DT', 'yyyy-mm-dd')).toBe(false)
    expect(ok('2026-00-10', 'DT', 'yyyy-mm-dd')).toBe(false)
    expect(valueFits('2026-11-03', 'DT', '')).toBe(
      '"2026-11-03" has no format: the UNIT row of a DT heading gives it',
    )
  })

  it('valueFits() T: elapsed time, hours past 24 allowed, minutes to 59', () => {
    expect([ok('30:15:00', 'T', 'hh:mm:ss'), ok('06:54', 'T', 'mm:ss')]).toEqual([true, true])
    expect([ok('00:75', 'T', 'hh:mm'), ok('1:05', 'T', 'hh:mm')]).toEqual([false, false])
  })

  it('valueFits() YN, U, DMS, and empty values (left to Rule 10b)', () => {
    expect([ok('Y', 'YN'), ok('n', 'YN'), ok('Yes', 'YN')]).toEqual([true, true, false])
    expect([ok('1e-1', 'U'), ok('-12.5', 'U'), ok('<0.01', 'U')]).toEqual([true, true, false])
    expect([ok('51:28:52.498', 'DMS'), ok('-2:05:11.9', 'DMS'), ok('51.48', 'DMS')]).toEqual([
      true,
      true,
      false,
    ])
    expect(['2DP', 'DT', 'YN', 'U'].every((t) => ok('', t, 'yyyy'))).toBe(true)
  })

  it('knownTypes: the 4.1.1 types, and nothing else', () => {
    const types = [
      '0DP',
      '3SF',
      '2SCI',
      'DMS',
      'DT',
      'ID',
      'MC',
      'PA',
      'PT',
      'PU',
      'RL',
      'T',
      'U',
      'X',
      'XN',
      'YN',
    ]
    expect(types.every((t) => knownTypes.test(t))).toBe(true)
    expect(['DATE', 'N', '2dp', 'XX'].some((t) => knownTypes.test(t))).toBe(false)
  })
})
