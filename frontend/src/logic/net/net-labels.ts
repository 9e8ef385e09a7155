// Greedy label placement beside point marks: the first of eight offsets whose box stays clear of
// the labels already placed and inside the drawing wins.
export interface LabelPlacement {
  x: number
  y: number
  anchor: 'start' | 'end' | 'middle'
}

interface Box {
  x0: number
  y0: number
  x1: number
  y1: number
}

const CHAR_WIDTH = 7.4
const HEIGHT = 14

function boxOf(p: LabelPlacement, width: number): Box {
  const x0 = p.anchor === 'start' ? p.x : p.anchor === 'end' ? p.x - width : p.x - width / 2
  return { x0, y0: p.y - HEIGHT + 2, x1: x0 + width, y1: p.y + 2 }
}

const overlaps = (a: Box, b: Box) => a.x0 < b.x1 && b.x0 < a.x1 && a.y0 < b.y1 && b.y0 < a.y1

/** Places each label near its point; `limit` is the half-size of the square drawing. */
export function placeLabels(
  items: readonly { x: number; y: number; text: string }[],
  limit: number,
  gap = 8,
): LabelPlacement[] {
  const placed: Box[] = items.map((p) => ({ x0: p.x - 4, y0: p.y - 4, x1: p.x + 4, y1: p.y + 4 }))
  return items.map((item) => {
    const width = item.text.length * CHAR_WIDTH
    const options: LabelPlacement[] = [
      { x: item.x + gap, y: item.y - gap / 2, anchor: 'start' },
      { x: item.x - gap, y: item.y - gap / 2, anchor: 'end' },
      { x: item.x + gap, y: item.y + gap + 6, anchor: 'start' },
      { x: item.x - gap, y: item.y + gap + 6, anchor: 'end' },
      { x: item.x, y: item.y - gap - 2, anchor: 'middle' },
      { x: item.x, y: item.y + gap + 12, anchor: 'middle' },
      { x: item.x + gap, y: item.y - gap - 10, anchor: 'start' },
      { x: item.x - gap, y: item.y + gap + 20, anchor: 'end' },
    ]
    const fits = (b: Box) => b.x0 > -limit && b.x1 < limit && b.y0 > -limit && b.y1 < limit
    const choice =
      options.find((o) => {
        const b = boxOf(o, width)
        return fits(b) && !placed.some((p) => overlaps(p, b))
      }) ?? options[0]
    placed.push(boxOf(choice, width))
    return choice
  })
}
