/** A row split into its fields, with the first quoting (Rule 5) or separator (Rule 6) fault. */
export interface SplitRow {
  fields: string[]
  fault?: { rule: '5' | '6'; message: string }
}

/**
 * Splits one line into fields the way AGS4 writes them: every field in double quotes, a quote
 * inside a field doubled (Rule 5), fields separated by commas (Rule 6). A fault is reported once
 * per line and the split goes on, so the later rules still see the fields.
 */
export function splitRow(line: string): SplitRow {
  const fields: string[] = []
  let fault: SplitRow['fault']
  const flag = (rule: '5' | '6', message: string) => (fault ??= { rule, message })
  let i = 0
  for (;;) {
    const n = fields.length + 1
    if (line[i] !== '"') {
      const comma = line.indexOf(',', i)
      const end = comma < 0 ? line.length : comma
      flag('5', `field ${n} is not enclosed in double quotes`)
      fields.push(line.slice(i, end))
      if (comma < 0) break
      i = comma + 1
      continue
    }
    let value = ''
    let j = i + 1
    for (;;) {
      const q = line.indexOf('"', j)
      if (q < 0) {
        flag('5', `field ${n} opens a double quote that is never closed`)
        value += line.slice(j)
        j = line.length
        break
      }
      value += line.slice(j, q)
      if (line[q + 1] === '"') {
        value += '"'
        j = q + 2
        continue
      }
      j = q + 1
      break
    }
    fields.push(value)
    if (j >= line.length) break
    if (line[j] === ',') {
      i = j + 1
      if (i >= line.length) {
        flag('5', `the line ends with a comma: field ${n + 1} is not enclosed in double quotes`)
        fields.push('')
        break
      }
      continue
    }
    // Something other than a comma after a closing quote: a separator other than the comma
    // (Rule 6), or a quote inside the field that was not doubled (Rule 5).
    if (/[;\t |]/.test(line[j])) {
      flag('6', `field ${n} is followed by ${JSON.stringify(line[j])}, not a comma`)
      i = j + 1
      continue
    }
    flag('5', `field ${n} holds a double quote that is not doubled`)
    const comma = line.indexOf(',', j)
    if (comma < 0) break
    i = comma + 1
  }
  return { fields, fault }
}
