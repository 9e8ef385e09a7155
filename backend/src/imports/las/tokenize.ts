import { isNumericText } from './header-line'
import type { LasDelimiter } from './types'

/**
 * Pushes [start, end) pairs of the fields in `text[from, to)`. SPACE: runs of blanks separate;
 * TAB / COMMA (LAS 3.0 DLM): each delimiter separates, blanks around a field are dropped, and an
 * empty field is kept (read as NULL). A field in double quotes runs to the closing quote, so a
 * delimiter inside it ("MDST, grey") is text (LAS 3.0: quoted strings may hold the delimiter); the
 * pair excludes the quotes. Returns the number of empty fields.
 */
export function tokenize(
  text: string,
  from: number,
  to: number,
  dlm: LasDelimiter,
  out: number[],
): number {
  if (dlm === 'SPACE') {
    let i = from
    while (i < to) {
      while (i < to && isBlank(text.charCodeAt(i))) i++
      if (i >= to) break
      if (text.charCodeAt(i) === QUOTE) {
        const close = closingQuote(text, i + 1, to)
        out.push(i + 1, close)
        i = close + 1
        continue
      }
      const a = i
      while (i < to && !isBlank(text.charCodeAt(i))) i++
      out.push(a, i)
    }
    return 0
  }
  const sep = dlm === 'TAB' ? 9 : 44
  let empty = 0
  let i = from
  for (;;) {
    while (i < to && text.charCodeAt(i) !== sep && isBlank(text.charCodeAt(i))) i++
    let s: number
    let e: number
    if (i < to && text.charCodeAt(i) === QUOTE) {
      s = i + 1
      e = closingQuote(text, s, to)
      i = e + 1
      while (i < to && text.charCodeAt(i) !== sep) i++
    } else {
      s = i
      while (i < to && text.charCodeAt(i) !== sep) i++
      e = i
      while (e > s && isBlank(text.charCodeAt(e - 1))) e--
    }
    if (s === e) empty++
    out.push(s, e)
    if (i >= to) break
    i++ // past the delimiter
  }
  return empty
}

const QUOTE = 34

/**
 * Offset of the quote closing a field opened just before `from` (a doubled quote `""` inside is a
 * quote character, as in CSV — RFC 4180 §2.7), or `to` when it is never closed.
 */
function closingQuote(text: string, from: number, to: number): number {
  let i = from
  for (;;) {
    const q = text.indexOf('"', i)
    if (q < 0 || q >= to) return to
    if (q + 1 < to && text.charCodeAt(q + 1) === QUOTE) {
      i = q + 2
      continue
    }
    return q
  }
}

const isBlank = (c: number) => c === 32 || c === 9

const POW10 = [1, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12, 1e13, 1e14, 1e15]

/**
 * The number in `text[a, b)`, or NaN when it is not one. Plain decimals of up to 15 digits take
 * the fast path m / 10^k: both are exact doubles, so the one correctly rounded division gives the
 * same double as Number() (Clinger 1990, "How to read floating point numbers accurately").
 * Anything else (exponents, long mantissas) goes through Number() after a character check.
 */
export function parseDecimal(text: string, a: number, b: number): number {
  let i = a
  const first = text.charCodeAt(i)
  const negative = first === 45
  if (negative || first === 43) i++
  let mantissa = 0
  let digits = 0
  let point = -1
  for (; i < b; i++) {
    const c = text.charCodeAt(i)
    if (c >= 48 && c <= 57) {
      mantissa = mantissa * 10 + (c - 48)
      digits++
    } else if (c === 46 && point < 0) point = digits
    else return slowNumber(text, a, b)
  }
  if (digits === 0) return NaN
  if (digits > 15) return slowNumber(text, a, b)
  const scale = point < 0 ? 0 : digits - point
  const value = scale === 0 ? mantissa : mantissa / POW10[scale]
  return negative ? -value : value
}

function slowNumber(text: string, a: number, b: number): number {
  if (!isNumericText(text, a, b)) return NaN
  const value = Number(text.slice(a, b))
  return Number.isFinite(value) ? value : NaN
}
