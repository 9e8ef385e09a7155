// The reconciliation's matching window and verdict thresholds as the user types them: what each
// means, its limits (the same as the server's query schema, ReconciliationQuery), and the check
// that keeps a half-typed value from being sent.
import type { ReconciliationAnswer } from '../../../../schema/index'

export type ReconcileOptions = ReconciliationAnswer['options']
export type ReconcileOptionKey = keyof ReconcileOptions

export const defaultOptions: ReconcileOptions = {
  depthWindow: 1,
  maxAngle: 20,
  okAngle: 5,
  wrongAngle: 15,
  minMatches: 3,
}

export interface OptionField {
  key: ReconcileOptionKey
  label: string
  unit: string
  /** What the number does, in one sentence. */
  meaning: string
  /** Exclusive lower bound, or inclusive when `integer`. */
  min: number
  max: number
  integer?: boolean
  step: number
}

export const optionFields: readonly OptionField[] = [
  {
    key: 'depthWindow',
    label: 'Depth window',
    unit: 'm',
    meaning:
      'A core and an image structure can pair when their depths differ by no more than this after the estimated shift.',
    min: 0,
    max: 5,
    step: 0.1,
  },
  {
    key: 'maxAngle',
    label: 'Largest pole angle',
    unit: '°',
    meaning: "Paired poles may differ by no more than this after the run's rotation.",
    min: 0,
    max: 90,
    step: 1,
  },
  {
    key: 'okAngle',
    label: 'Ok up to',
    unit: '°',
    meaning: "A run whose residual angle is at most this reads 'ok'.",
    min: 0,
    max: 90,
    step: 1,
  },
  {
    key: 'wrongAngle',
    label: 'Wrong above',
    unit: '°',
    meaning: "A residual above this reads 'wrong'; between the two limits it reads 'suspect'.",
    min: 0,
    max: 180,
    step: 1,
  },
  {
    key: 'minMatches',
    label: 'Fewest pairs',
    unit: 'per run',
    meaning: 'A run with fewer pairs than this gets no rotation and no verdict.',
    min: 2,
    max: 100,
    integer: true,
    step: 1,
  },
]

export type OptionTexts = Record<ReconcileOptionKey, string>
export type OptionErrors = Partial<Record<ReconcileOptionKey, string>>

export const optionTexts = (options: ReconcileOptions): OptionTexts => ({
  depthWindow: String(options.depthWindow),
  maxAngle: String(options.maxAngle),
  okAngle: String(options.okAngle),
  wrongAngle: String(options.wrongAngle),
  minMatches: String(options.minMatches),
})

function parseField(field: OptionField, text: string): number | string {
  const trimmed = text.trim().replace(',', '.')
  if (trimmed === '') return 'give a number'
  const value = Number(trimmed)
  if (!Number.isFinite(value)) return 'must be a number'
  if (field.integer) {
    if (!Number.isInteger(value)) return 'must be a whole number'
    if (value < field.min || value > field.max) return `from ${field.min} to ${field.max}`
  } else if (value <= field.min || value > field.max) {
    return `more than ${field.min}, at most ${field.max} ${field.unit}`
  }
  return value
}

/**
 * The typed values as options, or the errors naming each bad field. Nothing is rounded or clipped:
 * a value outside the limits is refused, never changed.
 */
export function parseOptions(texts: OptionTexts): {
  options?: ReconcileOptions
  errors: OptionErrors
} {
  const errors: OptionErrors = {}
  const values: Partial<ReconcileOptions> = {}
  for (const field of optionFields) {
    const parsed = parseField(field, texts[field.key])
    if (typeof parsed === 'string') errors[field.key] = parsed
    else values[field.key] = parsed
  }
  if (values.okAngle !== undefined && values.wrongAngle !== undefined)
    if (values.wrongAngle < values.okAngle) errors.wrongAngle = 'must be at least the ok limit'
  if (Object.keys(errors).length > 0) return { errors }
  return { options: values as ReconcileOptions, errors }
}

/** Only the options that differ from the server's defaults, so a plain request stays plain. */
export function changedOptions(options: ReconcileOptions): Partial<ReconcileOptions> {
  const out: Partial<ReconcileOptions> = {}
  for (const field of optionFields)
    if (options[field.key] !== defaultOptions[field.key]) out[field.key] = options[field.key]
  return out
}
