// Short forms the entry grid accepts for its word fields, so a logger never leaves the keyboard:
// the word, a unique start of it, or a number where the classes are numbered (ISRM 1978: roughness
// I–IX, weathering grades I–VI).
import {
  confidences,
  parseStructureType,
  persistenceClasses,
  roughnessClasses,
  structureStates,
  structureTypes,
  weatheringGrades,
} from '../../../../schema/vocabulary'

const roman = ['I', 'II', 'III', 'IV', 'V', 'VI', 'VII', 'VIII', 'IX']

/** The word for a typed value among `words`: exact, numbered (1-based) or a unique start. */
export function pickWord(
  text: string,
  words: readonly string[],
  numbered = false,
): string | undefined {
  const t = text.trim().toLowerCase()
  if (t === '') return undefined
  const exact = words.find((w) => w.toLowerCase() === t)
  if (exact) return exact
  if (numbered) {
    const n = /^\d+$/.test(t) ? Number(t) : roman.findIndex((r) => r.toLowerCase() === t) + 1
    if (n >= 1 && n <= words.length) return words[n - 1]
  }
  const starts = words.filter((w) => w.toLowerCase().startsWith(t))
  return starts.length === 1 ? starts[0] : undefined
}

/** A structure type from our two-letter codes, the word, or a unique start of the word. */
export function pickStructureType(text: string): string | undefined {
  return parseStructureType(text) ?? pickWord(text.replace(/\s+/g, '-'), structureTypes)
}

export const choiceFields = {
  roughness: { words: roughnessClasses, numbered: true },
  persistence: { words: persistenceClasses, numbered: false },
  wallWeathering: { words: weatheringGrades, numbered: true },
  state: { words: structureStates, numbered: false },
  confidence: { words: confidences, numbered: false },
} as const
export type ChoiceField = keyof typeof choiceFields

export function pickChoice(field: ChoiceField, text: string): string | undefined {
  const { words, numbered } = choiceFields[field]
  // Roughness classes are Roman numerals: match them as written before trying starts.
  if (field === 'roughness') {
    const upper = text.trim().toUpperCase()
    if ((roughnessClasses as readonly string[]).includes(upper)) return upper
  }
  return pickWord(text, words, numbered)
}
