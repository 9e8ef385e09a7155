import { describe, expect, it } from 'vitest'
import {
  BIG_STEP,
  pickKeyAction,
  pickKeyLegend,
  ZOOM_STEP,
} from '../../frontend/src/logic/image-picking/pick-keys'
import { moveCrosshair, snapToSample } from '../../frontend/src/logic/image-picking/crosshair'

// GSQ-BH02, an invented image: 360 samples a turn, 2 mm rows from 30 m to 34 m (2000 rows), the
// left edge at azimuth 10°.
const grid = { topDepth: 30, bottomDepth: 34, height: 2000, width: 360, leftAzimuth: 10 }

describe('pickKeyAction(): the picking keys', () => {
  it.each([
    [{ key: 'ArrowUp' }, { kind: 'move', rows: -1, columns: 0 }],
    [{ key: 'ArrowDown' }, { kind: 'move', rows: 1, columns: 0 }],
    [{ key: 'ArrowLeft' }, { kind: 'move', rows: 0, columns: -1 }],
    [
      { key: 'ArrowRight', shiftKey: true },
      { kind: 'move', rows: 0, columns: BIG_STEP },
    ],
    [
      { key: 'ArrowDown', shiftKey: true },
      { kind: 'move', rows: BIG_STEP, columns: 0 },
    ],
    [{ key: ' ' }, { kind: 'add-point' }],
    [{ key: 'Backspace' }, { kind: 'drop-point' }],
    [{ key: 'Enter' }, { kind: 'accept' }],
    [{ key: 'Escape' }, { kind: 'clear' }],
    [{ key: '[' }, { kind: 'step-pick', by: -1 }],
    [{ key: ']' }, { kind: 'step-pick', by: 1 }],
    [{ key: 't' }, { kind: 'retype' }],
    [{ key: 'T', shiftKey: true }, { kind: 'retype' }],
    [{ key: 'Delete' }, { kind: 'delete' }],
    [{ key: 'u' }, { kind: 'undo-delete' }],
    [{ key: 'z', ctrlKey: true }, { kind: 'undo-delete' }],
    [{ key: 'm' }, { kind: 'edit-points' }],
    [{ key: '+' }, { kind: 'zoom', factor: 1 / ZOOM_STEP }],
    [{ key: '=' }, { kind: 'zoom', factor: 1 / ZOOM_STEP }],
    [{ key: '-' }, { kind: 'zoom', factor: ZOOM_STEP }],
    [{ key: 'PageUp' }, { kind: 'pan', screens: -0.8 }],
    [{ key: 'PageDown' }, { kind: 'pan', screens: 0.8 }],
    [{ key: 'g' }, { kind: 'go-to-depth' }],
    [{ key: 's' }, { kind: 'suggest' }],
  ])('%o → %o', (press, action) => {
    expect(pickKeyAction(press)).toEqual(action)
  })

  it('leaves other keys, Alt chords and browser shortcuts (Ctrl+S, Ctrl+T) to the browser', () => {
    for (const press of [
      { key: 'x' },
      { key: 'Tab' },
      { key: 'ArrowUp', altKey: true },
      { key: 's', ctrlKey: true },
      { key: 't', metaKey: true },
    ])
      expect(pickKeyAction(press)).toBeNull()
  })

  it('every key in the legend does something', () => {
    const firstKey: Record<string, string> = {
      '← → ↑ ↓': 'ArrowLeft',
      Space: ' ',
      Esc: 'Escape',
      '[  ]': '[',
      'U or Ctrl+Z': 'u',
      '+  −': '+',
      'PgUp  PgDn': 'PageUp',
    }
    for (const { keys } of pickKeyLegend) {
      const key = firstKey[keys] ?? (keys.length === 1 ? keys.toLowerCase() : keys)
      expect(pickKeyAction({ key }), keys).not.toBeNull()
    }
  })
})

describe('the keyboard crosshair', () => {
  it('snapToSample() puts it on the centre of a sample: row top + (i + ½)·step, column likewise', () => {
    const p = snapToSample(grid, { depth: 30.0031, azimuth: 10.2 })
    expect(p.depth).toBeCloseTo(30.003, 9)
    expect(p.azimuth).toBeCloseTo(10.5, 9)
  })

  it('moveCrosshair() moves one row / one sample, and ten with the big step', () => {
    const p = snapToSample(grid, { depth: 31, azimuth: 100 })
    const down = moveCrosshair(grid, p, 1, 0)
    expect(down.depth - p.depth).toBeCloseTo(0.002, 9)
    const right = moveCrosshair(grid, p, 0, BIG_STEP)
    expect(right.azimuth - p.azimuth).toBeCloseTo(10, 9)
  })

  it('moveCrosshair() goes round in azimuth and stops at the ends of the image in depth', () => {
    const p = snapToSample(grid, { depth: 30.0005, azimuth: 9.9 })
    expect(p.azimuth).toBeCloseTo(9.5, 9)
    expect(moveCrosshair(grid, p, 0, 1).azimuth).toBeCloseTo(10.5, 9)
    expect(moveCrosshair(grid, p, -5, 0).depth).toBeCloseTo(30.001, 9)
    expect(moveCrosshair(grid, p, 5000, 0).depth).toBeCloseTo(33.999, 9)
  })

  it('moveCrosshair() zoomed out steps a screen pixel when that is longer than a row', () => {
    const p = snapToSample(grid, { depth: 31, azimuth: 100 })
    expect(moveCrosshair(grid, p, 1, 0, 0.01).depth - p.depth).toBeCloseTo(0.01, 9)
  })
})
