import { refuse } from './types'

/** Share of control bytes above which a file is treated as binary, not LAS text. */
const MAX_CONTROL_SHARE = 0.01

const isControl = (c: number) =>
  // tab, LF, CR, form feed and the DOS end-of-file mark (0x1A) occur in real text files
  (c < 0x20 && c !== 0x09 && c !== 0x0a && c !== 0x0d && c !== 0x0c && c !== 0x1a) || c === 0x7f

/** 1-based line of a character offset, counting CRLF, LF and a bare CR as one line end each. */
function lineOfOffset(text: string, offset: number): number {
  let line = 1
  for (let i = 0; i < offset; i++) {
    const c = text.charCodeAt(i)
    if (c === 0x0a || (c === 0x0d && text.charCodeAt(i + 1) !== 0x0a)) line++
  }
  return line
}

/** How the bytes were read, for a notice: UTF-8 (or ASCII) needs none. */
export type LasEncoding = 'utf-8' | 'utf-16le' | 'utf-16be' | 'windows-1252'

/**
 * UTF-16 by its byte-order mark, or without one by where the zero bytes fall: LAS text is almost
 * all ASCII, so UTF-16LE puts a zero in every odd byte and UTF-16BE in every even one. Of the
 * first 4 KiB, at least 90 % of one parity zero and under 10 % of the other decides it.
 */
export function utf16Order(bytes: Uint8Array): 'utf-16le' | 'utf-16be' | null {
  if (bytes.length >= 2 && bytes[0] === 0xff && bytes[1] === 0xfe) return 'utf-16le'
  if (bytes.length >= 2 && bytes[0] === 0xfe && bytes[1] === 0xff) return 'utf-16be'
  const n = Math.min(bytes.length, 4096) & ~1
  if (n < 8) return null
  let evenZero = 0
  let oddZero = 0
  for (let i = 0; i < n; i += 2) {
    if (bytes[i] === 0) evenZero++
    if (bytes[i + 1] === 0) oddZero++
  }
  const half = n / 2
  if (oddZero >= 0.9 * half && evenZero < 0.1 * half) return 'utf-16le'
  if (evenZero >= 0.9 * half && oddZero < 0.1 * half) return 'utf-16be'
  return null
}

/**
 * Bytes → text, refusing binary content: any NUL, or more than 1 % control characters. UTF-16
 * (LE or BE, with or without a byte-order mark) is decoded as such; otherwise UTF-8 when the bytes
 * are valid UTF-8, else Windows-1252 (the WHATWG decoder for "latin1" labels: older LAS writers use
 * it for ° and µ). Line ends are made uniform: CRLF, LF and a bare CR each end one line, even mixed
 * in one file [common practice: files in the field].
 */
export function decodeLasText(bytes: Uint8Array): { text: string; encoding: LasEncoding } {
  const order = utf16Order(bytes)
  let text: string
  let encoding: LasEncoding
  if (order) {
    text = new TextDecoder(order).decode(bytes)
    encoding = order
  } else {
    try {
      text = new TextDecoder('utf-8', { fatal: true }).decode(bytes)
      encoding = 'utf-8'
    } catch {
      text = new TextDecoder('windows-1252').decode(bytes)
      encoding = 'windows-1252'
    }
  }
  refuseBinary(text)
  return { text: uniformLineEnds(text), encoding }
}

/** decodeLasText's text alone. */
export function decodeLas(bytes: Uint8Array): string {
  return decodeLasText(bytes).text
}

/** Refuses text with a NUL anywhere or over 1 % control characters, naming the first's line. */
export function refuseBinary(text: string): void {
  let controls = 0
  let firstControl = -1
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i)
    if (c === 0) refuse(lineOfOffset(text, i), 'The file holds binary data (a NUL byte), not text.')
    if (isControl(c)) {
      controls++
      if (firstControl < 0) firstControl = i
    }
  }
  if (controls > 0 && controls > text.length * MAX_CONTROL_SHARE) {
    refuse(
      lineOfOffset(text, firstControl),
      `The file looks binary, not text: ${controls} control bytes.`,
    )
  }
}

/** CRLF and bare CR → LF, in one pass. */
export function uniformLineEnds(text: string): string {
  if (text.indexOf('\r') < 0) return text
  return text.replaceAll('\r\n', '\n').replaceAll('\r', '\n')
}

/**
 * Walks the lines of `text[from, to)` without copying them: after `next()`, the line is
 * `text.slice(start, end)` (no CR/LF) and `number` is its 1-based line number in the file.
 */
export class LineCursor {
  start = 0
  end = 0
  number: number
  private pos: number

  constructor(
    private readonly text: string,
    from = 0,
    private readonly to = text.length,
    firstLine = 1,
  ) {
    this.pos = from
    this.number = firstLine - 1
  }

  next(): boolean {
    if (this.pos >= this.to) return false
    const nl = this.text.indexOf('\n', this.pos)
    const lineEnd = nl < 0 || nl >= this.to ? this.to : nl
    this.start = this.pos
    this.end =
      lineEnd > this.start && this.text.charCodeAt(lineEnd - 1) === 13 ? lineEnd - 1 : lineEnd
    this.pos = lineEnd + 1
    this.number++
    return true
  }

  /** Offset just past this line's newline: where the next line starts. */
  get nextOffset(): number {
    return this.pos
  }

  /** Index of the first non-blank character, or `end` for a blank line. */
  firstNonBlank(): number {
    let i = this.start
    while (i < this.end) {
      const c = this.text.charCodeAt(i)
      if (c !== 32 && c !== 9) break
      i++
    }
    return i
  }
}
