/**
 * A small reader for the simple mails we send (text, or text + HTML as multipart/alternative),
 * enough for the fake SMTP server; not a general MIME parser.
 */
export interface ParsedMail {
  from: string
  to: string
  subject: string
  text: string
  html: string | null
}

type Headers = Map<string, string>

function splitPart(raw: string): { headers: Headers; body: string } {
  const normalised = raw.replace(/\r\n/g, '\n')
  const end = normalised.indexOf('\n\n')
  const head = end < 0 ? normalised : normalised.slice(0, end)
  const body = end < 0 ? '' : normalised.slice(end + 2)
  const headers: Headers = new Map()
  // Continuation lines start with white space (RFC 5322 §2.2.3 folding).
  for (const line of head.replace(/\n[ \t]+/g, ' ').split('\n')) {
    const colon = line.indexOf(':')
    if (colon > 0)
      headers.set(line.slice(0, colon).trim().toLowerCase(), line.slice(colon + 1).trim())
  }
  return { headers, body }
}

function decodeBytes(bytes: Buffer, charset: string): string {
  try {
    return new TextDecoder(charset).decode(bytes)
  } catch {
    return bytes.toString('utf8')
  }
}

function decodeQuotedPrintable(body: string): Buffer {
  const joined = body.replace(/=\n/g, '')
  const bytes: number[] = []
  for (let i = 0; i < joined.length; i++) {
    const hex = joined.slice(i + 1, i + 3)
    if (joined[i] === '=' && /^[0-9A-Fa-f]{2}$/.test(hex)) {
      bytes.push(parseInt(hex, 16))
      i += 2
    } else bytes.push(...Buffer.from(joined[i], 'utf8'))
  }
  return Buffer.from(bytes)
}

/** Encoded words in headers (RFC 2047), B and Q forms. */
export function decodeHeader(value: string): string {
  return value
    .replace(/\?=\s+=\?/g, '?==?')
    .replace(
      /=\?([^?]+)\?([BbQq])\?([^?]*)\?=/g,
      (_m, charset: string, enc: string, text: string) => {
        const bytes =
          enc.toUpperCase() === 'B'
            ? Buffer.from(text, 'base64')
            : decodeQuotedPrintable(text.replace(/_/g, ' '))
        return decodeBytes(bytes, charset)
      },
    )
}

function param(header: string | undefined, name: string): string | undefined {
  const match = header?.match(new RegExp(`${name}="?([^";]+)"?`, 'i'))
  return match?.[1]
}

function decodeBody(headers: Headers, body: string): string {
  const encoding = (headers.get('content-transfer-encoding') ?? '7bit').toLowerCase()
  const charset = param(headers.get('content-type'), 'charset') ?? 'utf-8'
  if (encoding === 'base64')
    return decodeBytes(Buffer.from(body.replace(/\s+/g, ''), 'base64'), charset)
  if (encoding === 'quoted-printable') return decodeBytes(decodeQuotedPrintable(body), charset)
  return body
}

function collect(raw: string, found: { text?: string; html?: string }): void {
  const { headers, body } = splitPart(raw)
  const type = (headers.get('content-type') ?? 'text/plain').toLowerCase()
  if (type.startsWith('multipart/')) {
    const boundary = param(headers.get('content-type'), 'boundary')
    if (!boundary) return
    const sections = body.split(`--${boundary}`).slice(1)
    for (const section of sections) {
      if (section.startsWith('--')) break
      // The line break before a boundary belongs to the boundary (RFC 2046 §5.1.1).
      collect(section.replace(/^\n/, '').replace(/\n$/, ''), found)
    }
  } else if (type.startsWith('text/html')) found.html ??= decodeBody(headers, body)
  else if (type.startsWith('text/')) found.text ??= decodeBody(headers, body)
}

export function parseMail(raw: string): ParsedMail {
  const { headers } = splitPart(raw)
  const found: { text?: string; html?: string } = {}
  collect(raw, found)
  return {
    from: decodeHeader(headers.get('from') ?? ''),
    to: decodeHeader(headers.get('to') ?? ''),
    subject: decodeHeader(headers.get('subject') ?? ''),
    text: (found.text ?? '').replace(/\n+$/, '\n'),
    html: found.html ?? null,
  }
}
