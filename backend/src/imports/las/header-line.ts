import type { HeaderItem } from './types'

const isBlank = (c: number) => c === 32 || c === 9

/**
 * Splits `MNEM.UNIT  VALUE : DESCRIPTION` as the CWLS LAS 2.0 standard prescribes: the mnemonic ends
 * at the first dot, the unit at the first blank after it (so `OHM-M` and `.1IN` survive, and a
 * single space is enough), the value at the LAST colon (so `12:30:00` survives). LAS 3.0 adds a
 * trailing `{format}` and `| association` after the description, cut off first because a format
 * may hold colons (`{hh:mm}`). Returns null for a line without a dot. Linear; no regular expressions.
 */
export function splitHeaderLine(
  line: string,
  lineNumber: number,
  version3: boolean,
): HeaderItem | null {
  const dot = line.indexOf('.')
  if (dot < 0) return null
  const mnemonic = line.slice(0, dot).trim()
  let unitEnd = dot + 1
  while (unitEnd < line.length && !isBlank(line.charCodeAt(unitEnd))) unitEnd++
  let rest = line.slice(unitEnd)
  let unit = line.slice(dot + 1, unitEnd)
  // The unit ends at the first blank after the dot (CWLS LAS 2.0, header line syntax), so `TIME.hh:mm  12:30 : time`
  // keeps the unit hh:mm. Only when nothing after the unit holds a colon is a colon inside it the
  // value's delimiter: `DEPT.M: depth`, written with no blank before the colon.
  const colonInUnit = rest.indexOf(':') < 0 ? unit.lastIndexOf(':') : -1
  if (colonInUnit >= 0) {
    rest = unit.slice(colonInUnit) + rest
    unit = unit.slice(0, colonInUnit)
  }
  let format = ''
  if (version3) {
    const bar = rest.lastIndexOf('|')
    if (bar >= 0 && rest.lastIndexOf(':') < bar) rest = rest.slice(0, bar)
    const trimmed = rest.trimEnd()
    if (trimmed.endsWith('}')) {
      const open = trimmed.lastIndexOf('{')
      if (open >= 0) {
        format = trimmed.slice(open + 1, -1).trim()
        rest = trimmed.slice(0, open)
      }
    }
  }
  const colon = rest.lastIndexOf(':')
  const value = (colon < 0 ? rest : rest.slice(0, colon)).trim()
  const description = colon < 0 ? '' : rest.slice(colon + 1).trim()
  return { mnemonic, unit: unit.trim(), value, description, format, line: lineNumber }
}

/** A header value as a number, or null when it is not one plain decimal number. */
export function headerNumber(value: string): number | null {
  const s = value.trim()
  if (s === '' || !isNumericText(s, 0, s.length)) return null
  const n = Number(s)
  return Number.isFinite(n) ? n : null
}

/** True when `text[from, to)` has only characters that can make a decimal number. */
export function isNumericText(text: string, from: number, to: number): boolean {
  if (to <= from) return false
  for (let i = from; i < to; i++) {
    const c = text.charCodeAt(i)
    // 0-9 . + - e E
    if (!((c >= 48 && c <= 57) || c === 46 || c === 43 || c === 45 || c === 101 || c === 69))
      return false
  }
  return true
}
