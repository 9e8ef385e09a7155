/** Whether a DATA value fits its AGS4 TYPE (empty values are checked by the required rules). */
export function valueFits(value: string, type: string, unit: string): string | undefined {
  if (value === '') return undefined
  const dpMatch = /^(\d+)DP$/.exec(type)
  if (dpMatch) {
    const n = Number(dpMatch[1])
    const pattern = n === 0 ? /^-?\d+$/ : new RegExp(`^-?\\d+\\.\\d{${n}}$`)
    return pattern.test(value) ? undefined : `"${value}" is not a number with exactly ${n} decimals`
  }
  const sf = /^(\d+)SF$/.exec(type)
  if (sf) {
    const digits = value.replace(/^-?0*\.?0*/, '').replace(/[.eE].*$|\./g, '')
    const ok = /^-?\d+(\.\d+)?$/.test(value) && digits.replace('.', '').length <= Number(sf[1])
    return ok ? undefined : `"${value}" is not given to ${sf[1]} significant figures`
  }
  const sci = /^(\d+)SCI$/.exec(type)
  if (sci) {
    const ok = new RegExp(`^-?\\d\\.\\d{${Number(sci[1]) - 1}}[eE][+-]?\\d+$`).test(value)
    return ok ? undefined : `"${value}" is not in scientific notation with ${sci[1]} digits`
  }
  switch (type) {
    case 'DT':
      return datePattern(unit).test(value) ? undefined : `"${value}" does not match "${unit}"`
    case 'YN':
      return /^(Y|N|y|n)$/.test(value) ? undefined : `"${value}" is not Y or N`
    case 'U':
      return Number.isFinite(Number(value)) ? undefined : `"${value}" is not a number`
    default:
      return undefined
  }
}

/** The AGS4 date-time format of a DT heading's UNIT row (e.g. yyyy-mm-dd) as a pattern. */
function datePattern(unit: string): RegExp {
  if (!unit) return /^$/
  const body = unit
    .replace(/[.*+?^${}()|[\]\\]/g, '\\$&')
    .replace(/yyyy/g, '\\d{4}')
    .replace(/mm|dd|hh|ss/g, '\\d{2}')
  return new RegExp(`^${body}$`)
}

export const knownTypes = /^(\d+DP|\d+SF|\d+SCI|DT|ID|X|XN|PA|PU|PT|RL|YN|U|MC|T|DMS)$/
