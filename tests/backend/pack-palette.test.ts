import { describe, expect, it } from 'vitest'
import { colourOf } from '../../backend/src/exports/net-geometry'
import { netSvg } from '../../backend/src/exports/net-svg'
import {
  setColour as screenColour,
  unassignedColour,
} from '../../frontend/src/logic/net/set-palette'

describe('one set palette for the screen and the pack', () => {
  it('colourOf() (pack nets) → the screen’s setColour() for sets 0..7, past the palette and none', () => {
    for (let i = 0; i < 8; i++) expect(colourOf(i)).toBe(screenColour(i))
    expect(new Set(Array.from({ length: 8 }, (_, i) => colourOf(i))).size).toBe(8)
    expect(colourOf(8)).toBe(screenColour(0))
    expect(colourOf(-1)).toBe(unassignedColour)
  })

  it('netSvg() → a set’s poles, circle and legend in the screen’s colour of that set', () => {
    const point = { x: 0.1, y: 0.2 }
    const svg = netSvg(
      {
        poles: [
          { point, setIndex: 0 },
          { point, setIndex: 1 },
          { point, setIndex: -1 },
        ],
        circles: [{ setIndex: 1, points: [point, { x: 0.3, y: 0.1 }] }],
        cones: [],
        intersections: [],
        setNames: ['J1', 'J2'],
      },
      'TST net',
      'equal-area',
    )
    expect(svg).toContain(`fill="${screenColour(0)}"`)
    expect(svg).toContain(`stroke="${screenColour(1)}"`)
    expect(svg).toContain(`<rect x="470" y="58" width="10" height="10" fill="${screenColour(1)}"/>`)
    expect(svg).toContain(`fill="${unassignedColour}"`)
    expect(svg).not.toContain('DRAFT')
  })
})
