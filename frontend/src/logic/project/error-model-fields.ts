// The error model's ten inputs as the editor lists them: grouped by what they are read from, each
// with its unit, its upper bound and where it acts. Every figure is one standard deviation (1σ).
import type { ErrorModelKey, ErrorModelValues } from '../../api/error-model'

export interface ErrorModelField {
  key: ErrorModelKey
  label: string
  unit: '°' | 'mm' | 'm'
  /** Upper bound the server accepts (schema ErrorModelBody); 0 is the lower bound of all. */
  max: number
}

export interface ErrorModelGroup {
  heading: string
  /** Which computed orientations this group's errors reach. */
  appliesTo: string
  fields: ErrorModelField[]
}

export const errorModelGroups: readonly ErrorModelGroup[] = [
  {
    heading: 'Hole survey',
    appliesTo: 'Every core and image structure of the hole, through the hole direction.',
    fields: [
      { key: 'surveyAzimuthSdMagnetic', label: 'Azimuth, magnetic tools', unit: '°', max: 30 },
      { key: 'surveyAzimuthSdGyro', label: 'Azimuth, gyroscopic tools', unit: '°', max: 30 },
      { key: 'surveyInclinationSd', label: 'Inclination', unit: '°', max: 10 },
    ],
  },
  {
    heading: 'Oriented core readings',
    appliesTo: 'Core structures (alpha and beta read on the core).',
    fields: [
      { key: 'alphaSd', label: 'Alpha', unit: '°', max: 30 },
      { key: 'betaSd', label: 'Beta', unit: '°', max: 90 },
    ],
  },
  {
    heading: 'Image picks',
    appliesTo: 'Image structures (sinusoids picked on a televiewer image).',
    fields: [
      { key: 'pickHeightSdMm', label: 'Sinusoid height', unit: 'mm', max: 200 },
      { key: 'pickTroughSd', label: 'Trough azimuth', unit: '°', max: 90 },
    ],
  },
  {
    heading: 'Compass readings',
    appliesTo: 'Structures entered as true dip and dip direction.',
    fields: [
      { key: 'trueDipSd', label: 'Dip', unit: '°', max: 30 },
      { key: 'trueDipDirectionSd', label: 'Dip direction', unit: '°', max: 90 },
    ],
  },
  {
    heading: 'Depth along hole',
    appliesTo: 'The hole direction taken at each structure’s depth.',
    fields: [{ key: 'depthSd', label: 'Depth', unit: 'm', max: 5 }],
  },
]

export const errorModelFields: readonly ErrorModelField[] = errorModelGroups.flatMap(
  (g) => g.fields,
)

/** What was typed in each input, kept as typed until it is saved. */
export type ErrorModelDraft = Record<ErrorModelKey, string>

export function draftOf(model: ErrorModelValues): ErrorModelDraft {
  const entries = errorModelFields.map((f) => [f.key, String(model[f.key])])
  return Object.fromEntries(entries) as ErrorModelDraft
}

/** The typed value as a number, or why it is not one the server takes. */
export function readField(
  field: ErrorModelField,
  text: string,
): { value: number } | { error: string } {
  const trimmed = text.trim()
  const value = Number(trimmed)
  if (trimmed === '' || !Number.isFinite(value)) return { error: 'Enter a number.' }
  if (value < 0) return { error: 'Must be 0 or more.' }
  if (value > field.max) return { error: `Must be at most ${field.max} ${field.unit}.` }
  return { value }
}

/** The whole model from the draft, or each field's reason when any is not a number in range. */
export function readDraft(
  draft: ErrorModelDraft,
): { model: ErrorModelValues } | { errors: Partial<Record<ErrorModelKey, string>> } {
  const model: Partial<ErrorModelValues> = {}
  const errors: Partial<Record<ErrorModelKey, string>> = {}
  for (const field of errorModelFields) {
    const read = readField(field, draft[field.key])
    if ('value' in read) model[field.key] = read.value
    else errors[field.key] = read.error
  }
  return Object.keys(errors).length ? { errors } : { model: model as ErrorModelValues }
}
