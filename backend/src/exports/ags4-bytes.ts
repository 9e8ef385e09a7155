/** UTF-8 when the bytes are valid UTF-8 (so a stray "é" is shown as such), else byte by byte. */
export function decodeAgsBytes(bytes: Buffer): { text: string; note?: string } {
  try {
    return { text: new TextDecoder('utf-8', { fatal: true }).decode(bytes) }
  } catch {
    return {
      text: bytes.toString('latin1'),
      note: 'The file is not valid UTF-8: it was read one byte per character (ISO 8859-1), so non-ASCII characters may show wrongly.',
    }
  }
}
