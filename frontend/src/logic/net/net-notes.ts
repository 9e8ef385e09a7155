// The net's corner notes: what is drawn and how, so an exported image explains itself.
import type { NetContourSettings, NetDisplay } from './net-types'
import type { NetProjection } from './net-geometry'

const projectionNames: Record<NetProjection, string> = {
  'equal-area': 'Equal-area',
  'equal-angle': 'Equal-angle',
}
const methodNames = { kamb: 'Kamb', exponential: 'Exponential kernel' } as const

export interface NetNoteInput {
  projection: NetProjection
  count: number
  display: NetDisplay
  maxPlanes: number
  contours: NetContourSettings | null
  max: number | undefined
  step: number | undefined
  blindAngle: number | null
}

export function netNotes(n: NetNoteInput): [string[], string[], string[], string[]] {
  const count = n.count.toLocaleString('en')
  const shown =
    n.display === 'planes' && n.count > n.maxPlanes
      ? [`${n.maxPlanes.toLocaleString('en')} of ${count}`, 'great circles drawn']
      : [`N = ${count}`, n.display === 'planes' ? 'great circles' : 'poles']
  const contours = n.contours
    ? [
        `${methodNames[n.contours.method]}, ${n.step ?? n.contours.step}σ steps`,
        `max ${n.max === undefined ? '—' : n.max.toFixed(1)}σ${n.contours.weighted ? ', Terzaghi' : ''}`,
      ]
    : []
  const blind =
    n.blindAngle === null
      ? []
      : ['⊕ hole axis', 'shaded: blind zone', `planes ≤ ${n.blindAngle}° to hole`]
  return [[projectionNames[n.projection], 'lower hemisphere'], contours, shown, blind]
}
