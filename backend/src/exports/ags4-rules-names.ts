import type { AgsContext } from './ags4-context'
import type { ParsedGroup } from './ags4-parse'
import { standardHeadingAnywhere } from './ags4-standard'

const groupForm = /^[A-Z0-9]{4}$/
const headingChars = /^[A-Z0-9_]{1,9}$/
const headingForm = /^[A-Z0-9]{4}_[A-Z0-9]{1,4}$/

/**
 * Names and definitions: group names of 4 capitals or digits (Rule 19), headings of at most
 * 9 such characters (19a) in GROUP_NAME form (19b), none twice (2c), every group and heading
 * from the dictionary or DICT (9), standard headings in dictionary order with the user-defined
 * ones after them (7), and those in DICT's order (18a).
 */
export function checkNames(ctx: AgsContext) {
  for (const g of ctx.groups) {
    if (!groupForm.test(g.name))
      ctx.report(g.line, '19', `group name "${g.name}" is not 4 upper-case letters or digits`)
    const def = ctx.defs.get(g.name)
    // Without a loaded dictionary an unknown group may yet be standard: said, not passed.
    if (!def && ctx.complete)
      ctx.report(
        g.line,
        '9',
        `group ${g.name} is not in the standard dictionary and not defined in DICT` +
          (ctx.byName.has('DICT') ? '' : ' (the file has no DICT group)'),
      )
    else if (!def) ctx.unchecked('group', g.name, g.line)
    checkHeadings(ctx, g)
  }
}

function checkHeadings(ctx: AgsContext, g: ParsedGroup) {
  const line = g.headingLine
  const std = ctx.standard.get(g.name)
  g.headings.forEach((h, i) => {
    if (g.headings.indexOf(h) !== i)
      ctx.report(line, '2c', `heading ${h} appears twice in ${g.name}`)
    const owned = headingForm.test(h) ? ownedBy(ctx, g.name, h) : false
    if (!headingChars.test(h))
      ctx.report(line, '19a', `heading "${h}" is not at most 9 upper-case letters, digits or _`)
    else if (owned === false)
      ctx.report(
        line,
        '19b',
        `heading "${h}" does not start with its group name ${g.name}_ (or the group of the heading it repeats)`,
      )
    const defined = ctx.heading(g.name, h)
    if (owned === undefined && defined) ctx.unchecked('names', g.name, line, h)
    if (!ctx.defs.has(g.name) || defined) return
    if (ctx.settled(g.name, h))
      ctx.report(
        line,
        '9',
        `heading ${h} is not a heading of ${g.name} in the standard dictionary and not defined in DICT`,
      )
    else ctx.unchecked('headings', g.name, line, h)
  })
  if (std)
    standardOrder(
      ctx,
      g,
      std.headings.map((x) => x.name),
    )
  dictOrder(ctx, g)
}

/**
 * 19b: the group's own prefix, or the name of a heading that exists already: a standard heading
 * of any group (FRAC_SET, SPEC_REF) or one DICT gives the group of its prefix. Undefined where
 * the dictionary in use cannot tell (the heading is then reported as unchecked under Rule 9).
 */
function ownedBy(ctx: AgsContext, group: string, heading: string): boolean | undefined {
  const prefix = heading.slice(0, 4)
  if (prefix === group || standardHeadingAnywhere(ctx.dictionary, heading)) return true
  if (ctx.defs.get(prefix)?.headings.some((x) => x.name === heading)) return true
  return ctx.settled(group, heading) ? false : undefined
}

/** Rule 7 over the headings the dictionary in use settles; an unsettled one is passed over. */
function standardOrder(ctx: AgsContext, g: ParsedGroup, order: string[]) {
  let best = -1
  let bestName = ''
  let userSeen = ''
  for (const h of g.headings) {
    const at = order.indexOf(h)
    if (at < 0) {
      if (ctx.heading(g.name, h) || ctx.settled(g.name, h)) userSeen ||= h
      continue
    }
    if (userSeen) {
      ctx.report(
        g.headingLine,
        '7',
        `standard heading ${h} comes after the user-defined heading ${userSeen}: user-defined headings go after all standard ones`,
      )
      return
    }
    if (at < best) {
      const expected = order.filter((x) => g.headings.includes(x)).join(', ')
      ctx.report(
        g.headingLine,
        '7',
        `${h} comes after ${bestName}; the dictionary order is ${expected}`,
      )
      return
    }
    best = at
    bestName = h
  }
}

/** 18a: user-defined headings stand in the order DICT lists them. */
function dictOrder(ctx: AgsContext, g: ParsedGroup) {
  const declared = (ctx.defs.get(g.name)?.headings ?? [])
    .filter((x) => x.source === 'dict')
    .map((x) => x.name)
  const present = g.headings.filter((h) => declared.includes(h))
  const expected = declared.filter((h) => present.includes(h))
  const wrong = present.findIndex((h, i) => h !== expected[i])
  if (wrong >= 0)
    ctx.report(
      g.headingLine,
      '18a',
      `user-defined headings of ${g.name} are not in DICT order: ${present[wrong]} where DICT puts ${expected[wrong]}`,
    )
}
