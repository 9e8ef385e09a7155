// The picking view's keyboard: one table from key to action, read by the view and shown in its
// legend, so what is documented is what runs.

export type PickAction =
  | { kind: 'move'; rows: number; columns: number }
  | { kind: 'add-point' }
  | { kind: 'drop-point' }
  | { kind: 'accept' }
  | { kind: 'clear' }
  | { kind: 'step-pick'; by: -1 | 1 }
  | { kind: 'retype' }
  | { kind: 'delete' }
  | { kind: 'undo-delete' }
  | { kind: 'edit-points' }
  | { kind: 'zoom'; factor: number }
  | { kind: 'pan'; screens: number }
  | { kind: 'go-to-depth' }
  | { kind: 'suggest' }

export interface KeyPress {
  key: string
  shiftKey?: boolean
  ctrlKey?: boolean
  metaKey?: boolean
  altKey?: boolean
}

/** Shift multiplies a crosshair step by this. */
export const BIG_STEP = 10
/** One press of + or − zooms by this factor (the wheel by its own amount). */
export const ZOOM_STEP = 1.5

/** The action a key press stands for, or null (the key is left to the browser). */
export function pickKeyAction(e: KeyPress): PickAction | null {
  if (e.altKey) return null
  const step = e.shiftKey ? BIG_STEP : 1
  const command = e.ctrlKey || e.metaKey
  if (command) return e.key.toLowerCase() === 'z' ? { kind: 'undo-delete' } : null
  switch (e.key) {
    case 'ArrowUp':
      return { kind: 'move', rows: -step, columns: 0 }
    case 'ArrowDown':
      return { kind: 'move', rows: step, columns: 0 }
    case 'ArrowLeft':
      return { kind: 'move', rows: 0, columns: -step }
    case 'ArrowRight':
      return { kind: 'move', rows: 0, columns: step }
    case ' ':
      return { kind: 'add-point' }
    case 'Backspace':
      return { kind: 'drop-point' }
    case 'Enter':
      return { kind: 'accept' }
    case 'Escape':
      return { kind: 'clear' }
    case '[':
      return { kind: 'step-pick', by: -1 }
    case ']':
      return { kind: 'step-pick', by: 1 }
    case 'Delete':
      return { kind: 'delete' }
    case '+':
    case '=':
      return { kind: 'zoom', factor: 1 / ZOOM_STEP }
    case '-':
    case '_':
      return { kind: 'zoom', factor: ZOOM_STEP }
    case 'PageUp':
      return { kind: 'pan', screens: -0.8 }
    case 'PageDown':
      return { kind: 'pan', screens: 0.8 }
  }
  switch (e.key.toLowerCase()) {
    case 't':
      return { kind: 'retype' }
    case 'u':
      return { kind: 'undo-delete' }
    case 'm':
      return { kind: 'edit-points' }
    case 'g':
      return { kind: 'go-to-depth' }
    case 's':
      return { kind: 'suggest' }
  }
  return null
}

/** The legend beside the image: the keys above, in our words. */
export const pickKeyLegend: readonly { keys: string; does: string }[] = [
  { keys: '← → ↑ ↓', does: 'move the crosshair one sample / one row (Shift: ten)' },
  { keys: 'Space', does: 'put a point at the crosshair' },
  { keys: 'Backspace', does: 'take the last point off' },
  { keys: 'Enter', does: 'keep the trace (choose type and confidence)' },
  { keys: 'Esc', does: 'drop the trace, or let go of the chosen pick' },
  { keys: '[  ]', does: 'previous / next pick' },
  { keys: 'T', does: 'change the type of the chosen pick' },
  { keys: 'M', does: 'move the points of the chosen pick' },
  { keys: 'Delete', does: 'delete the chosen pick' },
  { keys: 'U or Ctrl+Z', does: 'bring back the pick just deleted' },
  { keys: '+  −', does: 'zoom in / out' },
  { keys: 'PgUp  PgDn', does: 'scroll up / down the hole' },
  { keys: 'G', does: 'go to a depth' },
  { keys: 'S', does: 'look for candidate traces in view' },
]
