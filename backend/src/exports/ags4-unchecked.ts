import { AGS_EDITION_FORM } from '../../../schema/ags'

/**
 * What a check against the built-in groups could not settle. group: a group Downdip does not
 * know (Rule 9); headings: headings of a known group it does not know (9, and so 7 and 19b);
 * names: DICT headings named after another group, not among those it knows (19b);
 * parent: child rows whose parent group's KEY headings it does not know (10c); links: record
 * links into such a group (11); dict: DICT headings of a group it cannot tell is standard (18).
 */
export type UncheckedKind = 'group' | 'headings' | 'names' | 'parent' | 'links' | 'dict'

export interface Unchecked {
  rule: string
  group: string
  line: number
  message: string
}

interface Item {
  kind: UncheckedKind
  group: string
  line: number
  names: Set<string>
  other?: string
}

export interface UncheckedSink {
  (kind: UncheckedKind, group: string, line: number, name?: string, other?: string): void
  items: () => Item[]
}

export function uncheckedSink(): UncheckedSink {
  const items = new Map<string, Item>()
  const sink = ((kind, group, line, name, other) => {
    const key = `${kind}|${group}|${other ?? ''}`
    const item = items.get(key) ?? { kind, group, line, names: new Set<string>(), other }
    if (name) item.names.add(name)
    items.set(key, item)
  }) as UncheckedSink
  sink.items = () => [...items.values()]
  return sink
}

const ruleOf: Record<UncheckedKind, string> = {
  group: '9',
  headings: '9',
  names: '19b',
  parent: '10c',
  links: '11',
  dict: '18',
}

/** Why it could not be settled, and what to do: name the dictionary that would settle it. */
export function missingDictionary(edition: string | null): string {
  return edition && AGS_EDITION_FORM.test(edition)
    ? `the ${edition} standard dictionary is not loaded: ask an administrator to load it`
    : 'the file names no AGS4 edition whose standard dictionary could be loaded'
}

const list = (names: Set<string>) => [...names].join(', ')

/** The unchecked items as findings of their own, one per group and kind, in line order. */
export function describeUnchecked(items: Item[], edition: string | null): Unchecked[] {
  const why = missingDictionary(edition)
  const unknownGroups = new Set(items.filter((i) => i.kind === 'group').map((i) => i.group))
  return items
    .filter((i) => i.kind === 'group' || !unknownGroups.has(i.group) || i.kind === 'links')
    .map((i) => {
      const many = i.names.size > 1
      const text: Record<UncheckedKind, () => string> = {
        group: () =>
          `group ${i.group} is not in the groups Downdip knows and ${why}. Its headings, their order, KEY and REQUIRED fields and parent rows were not checked.`,
        headings: () =>
          `${many ? 'headings' : 'heading'} ${list(i.names)} of ${i.group} ${many ? 'are' : 'is'} not among the headings Downdip knows and ${why}. ${many ? 'Their' : 'Its'} definition, order and name were not checked.`,
        names: () =>
          `${many ? 'headings' : 'heading'} ${list(i.names)} of ${i.group} ${many ? 'do' : 'does'} not start with ${i.group}_ and ${many ? 'are' : 'is'} not among the headings Downdip knows, and ${why}: whether ${many ? 'they repeat standard headings' : 'it repeats a standard heading'} of another group was not checked.`,
        parent: () =>
          `rows of ${i.group} were not matched to their parent group ${i.other}: Downdip does not know the KEY headings of ${i.other} and ${why}.`,
        links: () =>
          `record links of ${list(i.names)} to ${i.other} were not checked: Downdip does not know the KEY headings of ${i.other} and ${why}.`,
        dict: () =>
          `DICT defines headings of ${i.group}, a group Downdip does not know and no DICT GROUP row defines; whether it is a standard group cannot be told: ${why}.`,
      }
      return {
        rule: ruleOf[i.kind],
        group: i.group,
        line: i.line,
        message: `Rule ${ruleOf[i.kind]}: ${text[i.kind]()}`,
      }
    })
    .sort((a, b) => a.line - b.line)
}
