/**
 * The AGS4 data types (the TYPE group's codes as the 4.1.1 dictionary lists them under DICT_DTYP):
 * nDP, nSF and nSCI numbers, DMS, DT, ID, MC, PA, PT, PU, RL, T, U, X, XN and YN.
 */
export const knownTypes = /^(\d+DP|\d+SF|\d+SCI|DMS|DT|ID|MC|PA|PT|PU|RL|T|U|X|XN|YN)$/

const anyNumber = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/
const fine = () => undefined

/** Significant figures of a written number; trailing zeros of a whole number count as optional. */
function fitsSignificant(value: string, n: number): boolean {
  const m = /^-?(\d+)(?:\.(\d+))?(?:[eE][+-]?\d+)?$/.exec(value)
  if (!m) return false
  const digits = (m[1] + (m[2] ?? '')).replace(/^0+/, '')
  if (digits === '') return true // zero, however written
  if (m[2] !== undefined) return digits.length === n
  // 100 at 2SF: the written zeros may or may not be significant.
  return digits.replace(/0+$/, '').length <= n && digits.length >= n
}

type Check = (value: string) => string | undefined
const by =
  (test: (v: string) => boolean, why: (v: string) => string): Check =>
  (v) =>
    test(v) ? undefined : why(v)

/**
 * The Rule 8 check of one column: built once from its TYPE and UNIT, then run on every value;
 * an empty value always passes (Rule 12; REQUIRED fields are Rule 10b's).
 */
export function checkerFor(type: string, unit: string): Check {
  const check = typeCheck(type, unit)
  return (value) => (value === '' ? undefined : check(value))
}

function typeCheck(type: string, unit: string): Check {
  const [, digits, kind] = /^(\d+)(DP|SF|SCI)$/.exec(type) ?? []
  const n = Number(digits)
  if (kind === 'DP') {
    const re = new RegExp(n === 0 ? '^-?\\d+$' : `^-?\\d+\\.\\d{${n}}$`)
    return by(
      (v) => re.test(v),
      (v) => `"${v}" is not a number with ${n} decimal places`,
    )
  }
  if (kind === 'SF')
    return by(
      (v) => fitsSignificant(v, n),
      (v) => `"${v}" is not given to ${n} significant figures`,
    )
  if (kind === 'SCI') {
    // nSCI: scientific notation with n decimal places in the mantissa (DICT_DTYP wording).
    const re = new RegExp(`^-?${n === 0 ? '\\d' : `\\d\\.\\d{${n}}`}[eE][+-]?\\d+$`)
    return by(
      (v) => re.test(v),
      (v) => `"${v}" is not in scientific notation with ${n} decimal places`,
    )
  }
  switch (type) {
    case 'DT':
    case 'T':
      return dateCheck(unit, type === 'T')
    case 'YN':
      return by(
        (v) => /^[YNyn]$/.test(v),
        (v) => `"${v}" is not Y or N`,
      )
    case 'U':
    case 'MC':
      return by(
        (v) => anyNumber.test(v),
        (v) => `"${v}" is not a number`,
      )
    case 'DMS':
      return by(
        (v) => /^-?\d{1,3}:[0-5]\d:[0-5]\d(\.\d+)?$/.test(v),
        (v) => `"${v}" is not degrees:minutes:seconds`,
      )
    default:
      return fine
  }
}

/** Why a DATA value does not fit its TYPE (Rule 8), or undefined when it does or is empty. */
export function valueFits(value: string, type: string, unit: string): string | undefined {
  return checkerFor(type, unit)(value)
}

const parts = /yyyy|mm|dd|hh|ss/g

/**
 * DT values against the pattern of their UNIT row (yyyy-mm-dd, yyyy-mm-ddThh:mm, …), with the
 * calendar and clock ranges checked; "mm" is the month before "hh" and minutes after it. T
 * (elapsed time) values are read the same way, their hours not bounded at 24.
 */
function dateCheck(unit: string, elapsed: boolean): Check {
  const what = elapsed ? 'T' : 'DT'
  if (!unit) return (v) => `"${v}" has no format: the UNIT row of a ${what} heading gives it`
  const names: string[] = []
  let hourSeen = false
  const body = unit.replace(/[.*+?^${}()|[\]\\]/g, '\\$&').replace(parts, (p) => {
    if (p === 'hh') hourSeen = true
    names.push(p === 'mm' ? (hourSeen ? 'min' : 'month') : p)
    return p === 'yyyy' ? '(\\d{4})' : p === 'hh' && elapsed ? '(\\d{2,})' : '(\\d{2})'
  })
  const regex = new RegExp(`^${body}$`)
  const max: Record<string, number> = {
    month: 12,
    dd: 31,
    hh: elapsed ? Infinity : 23,
    min: 59,
    ss: 59,
  }
  const min: Record<string, number> = { month: 1, dd: 1 }
  return (value) => {
    const m = regex.exec(value)
    if (!m) return `"${value}" does not match "${unit}"`
    for (const [i, name] of names.entries()) {
      const v = Number(m[i + 1])
      if (v > (max[name] ?? Infinity) || v < (min[name] ?? 0))
        return `"${value}" is not a valid ${elapsed ? 'time' : 'date and time'} in "${unit}"`
    }
    return undefined
  }
}
