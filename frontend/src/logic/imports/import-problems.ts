// Reading an import's refusal into rows a logger can act on: which data row and file line, which
// column, and why. The server names them in `details` (`file.line.12.alpha`, `mapping.depth`).
import type { ErrorDetail } from '../../api/types'

export interface ProblemRow {
  /** Data row (1 = first row under the header), when the server says. */
  row: number | null
  /** Line of the file. */
  line: number | null
  /** A column of the file, a mapping field or an option. */
  column: string
  reason: string
}

const LINE_PATH = /^file\.line\.(\d+)(?:\.(.+))?$/
const PREFIX = /^row (\d+) \(line \d+\)(?:, column [^:]*)?: /

export function problemRows(details: readonly ErrorDetail[]): ProblemRow[] {
  return details.map((d) => {
    const line = LINE_PATH.exec(d.path)
    if (line) {
      const row = PREFIX.exec(d.message)
      return {
        row: row ? Number(row[1]) : null,
        line: Number(line[1]),
        column: line[2] ?? '',
        reason: d.message.replace(PREFIX, ''),
      }
    }
    const [scope, ...rest] = d.path.split('.')
    const column =
      scope === 'mapping' ? `mapping: ${rest.join('.')}` : scope === 'options' ? d.path : d.path
    return { row: null, line: null, column, reason: d.message }
  })
}

const DELIMITERS = [',', ';', '\t', '|']

/**
 * The header row of a CSV, read from its first 64 KB only: the columns to offer in the mapping
 * when the server refused the file before reading its rows.
 */
export async function sniffHeaders(file: Blob): Promise<string[]> {
  const head = await file.slice(0, 64 * 1024).text()
  const first = head
    .replace(/^\uFEFF/, '')
    .split(/\r?\n/)
    .find((l) => l.trim() !== '')
  if (!first) return []
  const delimiter = DELIMITERS.map((d) => ({ d, n: first.split(d).length })).sort(
    (a, b) => b.n - a.n,
  )[0]!.d
  return first.split(delimiter).map((h) => h.trim().replace(/^"(.*)"$/, '$1'))
}

const normalise = (s: string) => s.toLowerCase().replace(/[^a-z0-9]/g, '')

/** Field → column where a header spells the field's name or label: a start for the mapping. */
export function guessMapping(
  headers: readonly string[],
  fields: readonly { name: string; label: string }[],
): Record<string, string> {
  const byKey = new Map(headers.map((h) => [normalise(h), h]))
  const out: Record<string, string> = {}
  for (const f of fields) {
    const hit = byKey.get(normalise(f.name)) ?? byKey.get(normalise(f.label))
    if (hit) out[f.name] = hit
  }
  return out
}
