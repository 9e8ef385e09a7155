/**
 * Spreadsheet formula injection (OWASP, "CSV Injection"): a text cell that starts with `=`, `+`,
 * `-`, `@`, a tab or a carriage return can run as a formula when a designer opens the file in a
 * spreadsheet. Such text cells get a leading apostrophe, which spreadsheets show as text and
 * which a reader can strip. Numbers stay numbers: "-12.5" or "+3e2" are left alone.
 */
const TRIGGER = /^[=+\-@\t\r]/
const NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/

export function neutraliseCell(text: string): string {
  if (!TRIGGER.test(text) || NUMBER.test(text)) return text
  return `'${text}`
}

/**
 * A free-text comment line (the `# ` preamble of our CSVs) read by a spreadsheet splits at its
 * commas and semicolons into cells: each piece is neutralised as a cell would be.
 */
export function neutraliseLine(text: string): string {
  return text
    .split(/([,;\t])/)
    .map((piece, i) => {
      if (i % 2 === 1) return piece
      const lead = piece.match(/^ */)![0]
      return lead + neutraliseCell(piece.slice(lead.length))
    })
    .join('')
}
