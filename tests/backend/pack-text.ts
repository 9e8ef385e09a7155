import Papa from 'papaparse'
import { parseAgs } from '../../backend/src/exports/ags4-parse'

/** A pack CSV as a table: its `#` header lines skipped, the column row as keys. */
export const parseCsv = (text: string) =>
  Papa.parse<Record<string, string>>(text, { header: true, skipEmptyLines: true, comments: '#' })

/** One AGS4 group's DATA rows as heading → value records. */
export function agsGroup(ags: string, name: string): Record<string, string>[] {
  const group = parseAgs(ags).groups.find((g) => g.name === name)
  if (!group) return []
  return group.data.map((r) => Object.fromEntries(group.headings.map((h, i) => [h, r.fields[i]])))
}

/**
 * The text of an uncompressed standard-font PDF, one array of strings per page content stream.
 * pdfkit writes standard-font text as hex strings inside TJ arrays, one array per line; the codes
 * are WinAnsiEncoding, where the em dash is 0x97 (PDF 32000-1:2008, Annex D.2).
 */
export function pdfText(pdf: Buffer): string[][] {
  const streams = [...pdf.toString('latin1').matchAll(/stream\r?\n([\s\S]*?)endstream/g)]
  return streams
    .map((s) =>
      [...s[1].matchAll(/\[([^\]]*)\] TJ/g)].map((m) =>
        [...m[1].matchAll(/<([0-9a-f]*)>/g)]
          .map((h) => Buffer.from(h[1], 'hex').toString('latin1'))
          .join('')
          .replace(/\x97/g, '—'),
      ),
    )
    .filter((page) => page.length > 0)
}
