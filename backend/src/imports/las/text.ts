import { refuse } from './types'

/** Share of control bytes above which a file is treated as binary, not LAS text. */
const MAX_CONTROL_SHARE = 0.01

const isControlByte = (b: number) =>
  // tab, LF, CR, form feed and the DOS end-of-file mark (0x1A) occur in real text files
  (b < 0x20 && b !== 0x09 && b !== 0x0a && b !== 0x0d && b !== 0x0c && b !== 0x1a) || b === 0x7f

function lineOfOffset(bytes: Uint8Array, offset: number): number {
  let line = 1
  for (let i = 0; i < offset; i++) if (bytes[i] === 0x0a) line++
  return line
}

/**
 * Bytes → text, refusing binary content: any NUL byte, or more than 1 % control bytes. UTF-8 when
 * the bytes are valid UTF-8, otherwise Latin-1 (older LAS writers use it for ° and µ).
 */
export function decodeLas(bytes: Uint8Array): string {
  let controls = 0
  let firstControl = -1
  for (let i = 0; i < bytes.length; i++) {
    const b = bytes[i]
    if (b === 0)
      refuse(lineOfOffset(bytes, i), 'The file holds binary data (a NUL byte), not text.')
    if (isControlByte(b)) {
      controls++
      if (firstControl < 0) firstControl = i
    }
  }
  if (controls > 0 && controls > bytes.length * MAX_CONTROL_SHARE) {
    refuse(
      lineOfOffset(bytes, firstControl),
      `The file looks binary, not text: ${controls} control bytes.`,
    )
  }
  let text: string
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(bytes)
  } catch {
    text = new TextDecoder('latin1').decode(bytes)
  }
  // files from classic Mac OS end lines with CR alone
  if (text.indexOf('\n') < 0 && text.indexOf('\r') >= 0) text = text.replaceAll('\r', '\n')
  return text
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
