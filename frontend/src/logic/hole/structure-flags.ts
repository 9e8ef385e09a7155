// Downdip's words and symbols for the quality flags of a structure (orient `structureFlags`): one
// place, so the entry grid, previews and imports show a flag the same way. Icon + word, never
// colour alone.

export interface FlagLook {
  label: string
  icon: string
  /** What the flag means for the value beside it. */
  hint: string
}

export const flagLooks: Record<string, FlagLook> = {
  'no-survey': {
    label: 'No survey',
    icon: 'pi pi-compass',
    hint: 'No survey stations: computed along the planned direction.',
  },
  'beyond-survey': {
    label: 'Below survey',
    icon: 'pi pi-arrow-down',
    hint: 'Deeper than the last survey station: its direction was held.',
  },
  'steep-hole': {
    label: 'Steep hole',
    icon: 'pi pi-exclamation-triangle',
    hint: "Hole steeper than the project's threshold: orientation marks are unreliable.",
  },
  'outside-run': {
    label: 'No run',
    icon: 'pi pi-ban',
    hint: 'No core run covers this depth.',
  },
  'poor-mark': {
    label: 'Poor mark',
    icon: 'pi pi-minus-circle',
    hint: "The run's orientation mark is poor.",
  },
  unoriented: {
    label: 'Unoriented',
    icon: 'pi pi-question-circle',
    hint: 'No usable orientation mark or no beta: alpha only, no dip direction.',
  },
  'blind-zone': {
    label: 'Blind zone',
    icon: 'pi pi-eye-slash',
    hint: 'Nearly parallel to the hole: Terzaghi weight capped.',
  },
  'beta-jump': {
    label: 'β jump',
    icon: 'pi pi-bolt',
    hint: 'Beta far from the previous structure of the same type in the run.',
  },
}

export function flagLook(flag: string): FlagLook {
  return flagLooks[flag] ?? { label: flag, icon: 'pi pi-flag', hint: flag }
}
