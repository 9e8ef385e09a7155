// The entry grid's row as typed (text per cell), the order Enter/Tab walk through it, and its
// parsing into the API's structure body with the same ranges the server checks.
import type { Structure, StructureInput } from '../../api/types'
import { pickChoice, pickStructureType, type ChoiceField } from './entry-choices'

export const attributeFields = [
  'roughness',
  'jrc',
  'apertureMm',
  'infillType',
  'infillThicknessMm',
  'persistence',
  'wallWeathering',
  'state',
  'confidence',
] as const
const angleFields = { core: ['alpha', 'beta', 'gamma'], true: ['dip', 'dipDirection'] } as const

export type AttributeField = (typeof attributeFields)[number]
export type EntryField =
  | 'depth'
  | 'type'
  | 'alpha'
  | 'beta'
  | 'gamma'
  | 'dip'
  | 'dipDirection'
  | AttributeField
  | 'comment'
export type EntrySource = 'core' | 'true'
export type EntryDraft = Record<EntryField, string>
export type EntryErrors = Partial<Record<EntryField, string>>

/** depth → type → angles → attributes (when shown) → comment. */
export function fieldOrder(source: EntrySource, attributes: boolean): EntryField[] {
  return [
    'depth',
    'type',
    ...angleFields[source],
    ...(attributes ? attributeFields : []),
    'comment',
  ]
}

export function emptyDraft(depth = ''): EntryDraft {
  const blank = Object.fromEntries(
    [...fieldOrder('core', true), 'dip', 'dipDirection'].map((f) => [f, '']),
  ) as EntryDraft
  return { ...blank, depth }
}

const text = (value: number | string | null | undefined) =>
  value === null || value === undefined ? '' : String(value)

/** A saved row back into cells, for editing in place. */
export function draftFromStructure(s: Structure): EntryDraft {
  return {
    depth: text(s.depth),
    type: s.type,
    alpha: text(s.alpha),
    beta: text(s.beta),
    gamma: text(s.gamma),
    dip: text(s.inputDip),
    dipDirection: text(s.inputDipDirection),
    roughness: text(s.roughness),
    jrc: text(s.jrc),
    apertureMm: text(s.apertureMm),
    infillType: text(s.infillType),
    infillThicknessMm: text(s.infillThicknessMm),
    persistence: text(s.persistence),
    wallWeathering: text(s.wallWeathering),
    state: text(s.state),
    confidence: text(s.confidence),
    comment: s.comment,
  }
}

/** Blank → undefined; a comma is taken as the decimal mark; anything else non-numeric → NaN. */
export function parseNumber(value: string): number | undefined {
  const t = value.trim().replace(',', '.')
  if (t === '') return undefined
  return /^[+-]?(\d+\.?\d*|\.\d+)$/.test(t) ? Number(t) : Number.NaN
}

// The API's ranges (schema/api-logging.ts `structureFields`), repeated here so the row says what is
// wrong before it is sent.
const ranges: Partial<Record<EntryField, [number, number, string]>> = {
  depth: [0, 5000, 'depth must be 0–5000 m'],
  alpha: [0, 90, 'alpha must be 0–90°'],
  beta: [0, 360, 'beta must be 0–360°'],
  gamma: [0, 360, 'gamma must be 0–360°'],
  dip: [0, 90, 'dip must be 0–90°'],
  dipDirection: [0, 360, 'dip direction must be 0–360°'],
  jrc: [0, 20, 'JRC must be 0–20'],
  apertureMm: [0, 10000, 'aperture must be 0–10000 mm'],
  infillThicknessMm: [0, 10000, 'infill thickness must be 0–10000 mm'],
}
const choices: ChoiceField[] = ['roughness', 'persistence', 'wallWeathering', 'state', 'confidence']

export interface ParsedEntry {
  /** The body to send, or null while a required value is missing or a value is out of range. */
  input: StructureInput | null
  /** Values that cannot be sent as typed (out of range, not a number, unknown word). */
  errors: EntryErrors
  /** Required cells still blank: named only once the logger tries to save. */
  missing: EntryField[]
}

/** Cells → API body. Persistence left blank is "not determined": it cannot be measured on core. */
export function parseEntry(draft: EntryDraft, source: EntrySource): ParsedEntry {
  const errors: EntryErrors = {}
  const out: Record<string, unknown> = { source }
  const numeric = ['depth', ...angleFields[source], 'jrc', 'apertureMm', 'infillThicknessMm']
  for (const field of numeric as EntryField[]) {
    const value = parseNumber(draft[field])
    const [min, max, message] = ranges[field]!
    if (value === undefined) continue
    if (Number.isNaN(value)) errors[field] = `${draft[field].trim()} is not a number`
    else if (value < min || value > max) errors[field] = message
    else out[field] = value
  }
  const required: EntryField[] = ['depth', 'type', ...(source === 'core' ? ['alpha' as const] : [])]
  if (source === 'true') required.push('dip', 'dipDirection')
  const missing = required.filter((f) => draft[f].trim() === '')
  const type = pickStructureType(draft.type)
  if (type) out.type = type
  else if (draft.type.trim())
    errors.type = `"${draft.type.trim()}" is not a type (jt, bd, fa… or a word)`
  for (const field of choices) {
    if (draft[field].trim() === '') continue
    const word = pickChoice(field, draft[field])
    if (word) out[field] = word
    else errors[field] = `"${draft[field].trim()}" is not a ${field} class`
  }
  out.persistence ??= 'not determined'
  if (draft.infillType.trim()) out.infillType = draft.infillType.trim()
  out.comment = draft.comment.trim()
  const ok = Object.keys(errors).length === 0 && missing.length === 0
  return { input: ok ? (out as unknown as StructureInput) : null, errors, missing }
}

/** Only what changed against the saved row: a smaller PATCH and a clearer audit trail. */
export function changedFields(saved: Structure, input: StructureInput): Partial<StructureInput> {
  const before: Record<string, unknown> = {
    ...saved,
    dip: saved.inputDip ?? undefined,
    dipDirection: saved.inputDipDirection ?? undefined,
  }
  const diff: Record<string, unknown> = {}
  for (const [key, value] of Object.entries(input)) {
    if (value !== (before[key] ?? undefined)) diff[key] = value
  }
  return diff as Partial<StructureInput>
}
