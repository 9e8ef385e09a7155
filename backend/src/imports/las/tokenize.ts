import type { LasDelimiter } from './types'

/**
 * Pushes [start, end) pairs of the fields in `text[from, to)`. SPACE: runs of blanks separate;
 * TAB / COMMA (LAS 3.0 DLM): each delimiter separates, blanks around a field are dropped, and an
 * empty field is kept (read as NULL). Returns the number of empty fields.
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
      const a = i
      while (i < to && !isBlank(text.charCodeAt(i))) i++
      out.push(a, i)
    }
    return 0
  }
  const sep = dlm === 'TAB' ? 9 : 44
  let empty = 0
  let a = from
  for (let i = from; i <= to; i++) {
    if (i < to && text.charCodeAt(i) !== sep) continue
    let s = a
    let e = i
    while (s < e && isBlank(text.charCodeAt(s))) s++
    while (e > s && isBlank(text.charCodeAt(e - 1))) e--
    if (s === e) empty++
    out.push(s, e)
    a = i + 1
  }
  return empty
}

const isBlank = (c: number) => c === 32 || c === 9
