import type { AgsHeadingDefinition } from '../../../schema/ags'
import { groupsWeWrite, GROUPS_WE_WRITE_EDITION } from './ags4-groups-we-write'

/** A heading's status in the dictionary: KEY fields identify a row, REQUIRED fields hold data. */
export type AgsStatus = AgsHeadingDefinition['status']

export type StandardHeading = AgsHeadingDefinition

export interface StandardGroup {
  name: string
  /** The group whose KEY fields each row must match (Rule 10c); undefined for none. */
  parent: string | undefined
  /** The group's title where a loaded dictionary gives one. */
  title?: string
  headings: StandardHeading[]
}

/**
 * The standard groups a file is checked against. `loaded`: an edition's whole standard dictionary
 * as an administrator loaded it, so a group or heading it lacks is not standard. `built-in`: only
 * the groups Downdip writes, each with only its headings, so what it lacks cannot be settled.
 */
export interface StandardDictionary {
  edition: string
  source: 'loaded' | 'built-in'
  groups: ReadonlyMap<string, StandardGroup>
}

export const isKey = (status: string) => status === 'KEY' || status === 'KEY+REQUIRED'
export const isRequired = (status: string) => status === 'REQUIRED' || status === 'KEY+REQUIRED'

/** The editions a TRAN_AGS may name (AGS4 issues to date). */
export const AGS_EDITIONS = ['4.0.3', '4.0.4', '4.1', '4.1.1', '4.2'] as const
/** The edition the built-in groups follow. */
export const BUILT_IN_EDITION = GROUPS_WE_WRITE_EDITION

export function dictionaryOf(
  edition: string,
  source: StandardDictionary['source'],
  groups: readonly StandardGroup[],
): StandardDictionary {
  return { edition, source, groups: new Map(groups.map((g) => [g.name, g])) }
}

let builtIn: StandardDictionary | undefined

/** The groups Downdip writes, as a dictionary of the edition they follow. */
export function builtInDictionary(): StandardDictionary {
  builtIn ??= dictionaryOf(BUILT_IN_EDITION, 'built-in', groupsWeWrite)
  return builtIn
}

/** One heading of a group as the dictionary defines it, or undefined. */
export function standardHeading(
  dictionary: StandardDictionary,
  group: string,
  heading: string,
): StandardHeading | undefined {
  return dictionary.groups.get(group)?.headings.find((h) => h.name === heading)
}

const anywhere = new WeakMap<StandardDictionary, Map<string, StandardHeading>>()

/**
 * A standard heading by name wherever the dictionary defines it: in the group of its prefix if
 * that group has it (LOCA_ID in LOCA), else the first group that does (SPEC_REF, TEST_STAT).
 */
export function standardHeadingAnywhere(
  dictionary: StandardDictionary,
  heading: string,
): StandardHeading | undefined {
  let index = anywhere.get(dictionary)
  if (!index) {
    index = new Map()
    for (const g of dictionary.groups.values())
      for (const h of g.headings)
        if (!index.has(h.name) || h.name.startsWith(g.name)) index.set(h.name, h)
    anywhere.set(dictionary, index)
  }
  return index.get(heading)
}
