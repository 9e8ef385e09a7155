import { createHash } from 'node:crypto'

export const sha256Hex = (data: string | Buffer) => createHash('sha256').update(data).digest('hex')

/** JSON with object keys sorted at every level and dates as ISO strings: the same rows, the same text. */
export function canonicalJson(value: unknown): string {
  return JSON.stringify(sortKeys(value))
}

function sortKeys(value: unknown): unknown {
  if (value instanceof Date) return value.toISOString()
  if (Buffer.isBuffer(value)) return value.toString('hex')
  if (Array.isArray(value)) return value.map(sortKeys)
  if (value !== null && typeof value === 'object') {
    const obj = value as Record<string, unknown>
    return Object.fromEntries(
      Object.keys(obj)
        .sort()
        .map((k) => [k, sortKeys(obj[k])]),
    )
  }
  return value
}

/** SHA-256 over the files' own SHA-256s, in name order: one fingerprint of a pack's content. */
export function contentHashOf(files: readonly { name: string; sha256: string }[]): string {
  const sorted = [...files].sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : 0))
  return sha256Hex(sorted.map((f) => f.sha256).join('\n'))
}
