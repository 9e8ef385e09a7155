// Downdip's one legend of structure symbols: a shape and a colour per type, used by the tadpole
// tracks, their legend and exports. Shapes and colours are our own choice; change them here only.
//
// Conventions of the tadpole tracks (our own): the symbol sits at the structure's depth and at x =
// its dip (0 left, 90 right); the tail starts at the symbol and points toward the dip direction as
// on a map, north up the page. Unoriented structures (no dip direction) are drawn hollow in their
// own lane at the left edge, never with a tail; flagged ones get an amber ring.
import type { StructureType } from '../../api/interval-types'

export type SymbolShape =
  'disc' | 'bar' | 'diamond' | 'spike' | 'tile' | 'notch' | 'hexagon' | 'slot' | 'star'

export interface StructureSymbol {
  label: string
  shape: SymbolShape
  colour: string
}

export const structureSymbols: Record<StructureType, StructureSymbol> = {
  joint: { label: 'Joint', shape: 'disc', colour: '#2f6fb0' },
  bedding: { label: 'Bedding', shape: 'bar', colour: '#a8781a' },
  foliation: { label: 'Foliation', shape: 'diamond', colour: '#8052b0' },
  fault: { label: 'Fault', shape: 'spike', colour: '#cf3b2f' },
  vein: { label: 'Vein', shape: 'tile', colour: '#27918f' },
  shear: { label: 'Shear', shape: 'notch', colour: '#c2417a' },
  contact: { label: 'Contact', shape: 'hexagon', colour: '#3f8d4e' },
  cleavage: { label: 'Cleavage', shape: 'slot', colour: '#6c6fa8' },
  'broken-zone': { label: 'Broken zone', shape: 'star', colour: '#8a5a3c' },
}

/** Ring colour of flagged structures (a value to check, never hidden). */
export const flaggedColour = '#d97706'

/** Tail length in pixels, from the symbol's centre. */
export const TAIL_LENGTH = 13

const n = (v: number) => (Math.round(v * 100) / 100).toString()

function polygon(x: number, y: number, points: [number, number][]): string {
  return points.map(([px, py], i) => `${i ? 'L' : 'M'}${n(x + px)},${n(y + py)}`).join('') + 'Z'
}

function regular(x: number, y: number, r: number, sides: number, turn = 0): string {
  const pts: [number, number][] = []
  for (let k = 0; k < sides; k++) {
    const a = turn + (2 * Math.PI * k) / sides
    pts.push([r * Math.sin(a), -r * Math.cos(a)])
  }
  return polygon(x, y, pts)
}

/** The outline of a symbol centred on (x, y) with radius r, as absolute SVG path data. */
export function symbolPath(shape: SymbolShape, x: number, y: number, r: number): string {
  switch (shape) {
    case 'disc':
      return `M${n(x - r)},${n(y)}a${r},${r} 0 1,0 ${2 * r},0a${r},${r} 0 1,0 ${-2 * r},0Z`
    case 'bar':
      return polygon(x, y, [
        [-r * 1.35, -r * 0.55],
        [r * 1.35, -r * 0.55],
        [r * 1.35, r * 0.55],
        [-r * 1.35, r * 0.55],
      ])
    case 'diamond':
      return polygon(x, y, [
        [0, -r * 1.3],
        [r, 0],
        [0, r * 1.3],
        [-r, 0],
      ])
    case 'spike':
      return regular(x, y, r * 1.25, 3)
    case 'tile':
      return polygon(x, y, [
        [-r * 0.9, -r * 0.9],
        [r * 0.9, -r * 0.9],
        [r * 0.9, r * 0.9],
        [-r * 0.9, r * 0.9],
      ])
    case 'notch':
      return regular(x, y, r * 1.25, 3, Math.PI)
    case 'hexagon':
      return regular(x, y, r * 1.1, 6)
    case 'slot':
      return polygon(x, y, [
        [-r * 0.5, -r * 1.3],
        [r * 0.5, -r * 1.3],
        [r * 0.5, r * 1.3],
        [-r * 0.5, r * 1.3],
      ])
    case 'star': {
      const pts: [number, number][] = []
      for (let k = 0; k < 8; k++) {
        const a = (Math.PI * k) / 4
        const rr = k % 2 ? r * 0.55 : r * 1.35
        pts.push([rr * Math.sin(a), -rr * Math.cos(a)])
      }
      return polygon(x, y, pts)
    }
  }
}

/** The tail of an oriented structure: from (x, y) toward the dip direction, north up. */
export function tailEnd(x: number, y: number, dipDirection: number, length = TAIL_LENGTH) {
  const a = (dipDirection * Math.PI) / 180
  return { x: x + length * Math.sin(a), y: y - length * Math.cos(a) }
}

export function symbolOf(type: string): StructureSymbol {
  return (
    (structureSymbols as Record<string, StructureSymbol>)[type] ?? {
      label: type,
      shape: 'disc',
      colour: '#7d8794',
    }
  )
}
