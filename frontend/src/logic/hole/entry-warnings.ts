// Plain-language warnings under a row being typed: range errors block saving; flags explain why
// the computed orientation deserves a second look (Live QA while logging).
import type { ComputeContext, StructureComputed } from '../../../../orient/index'
import { formatAngle } from '../format'
import type { EntryErrors, EntryField } from './entry-fields'
import { flagLook } from './structure-flags'

export interface EntryNote {
  level: 'error' | 'warn'
  text: string
  flag?: string
}

const fieldNames: Record<string, string> = { dipDirection: 'dip direction' }

export function entryNotes(
  errors: EntryErrors,
  missing: readonly EntryField[],
  computed: StructureComputed | null,
  ctx: ComputeContext | null,
  hasBeta: boolean,
): EntryNote[] {
  const notes: EntryNote[] = [
    ...missing.map((f): EntryNote => ({
      level: 'error',
      text: `${fieldNames[f] ?? f} is required`,
    })),
    ...Object.values(errors).map((text): EntryNote => ({ level: 'error', text })),
  ]
  if (!computed || !ctx) return notes
  for (const flag of computed.flags) {
    notes.push({ level: 'warn', flag, text: flagText(flag, computed, ctx, hasBeta) })
  }
  return notes
}

function flagText(
  flag: string,
  c: StructureComputed,
  ctx: ComputeContext,
  hasBeta: boolean,
): string {
  switch (flag) {
    case 'steep-hole':
      return `Hole plunges ${formatAngle(c.holePlunge)} here, at or above the project's steep-hole threshold of ${formatAngle(ctx.steepThresholdDeg, 0)}: the orientation mark is unreliable.`
    case 'outside-run':
      return 'No core run covers this depth: check the depth or enter the run first.'
    case 'poor-mark':
      return "This run's orientation mark is poor: treat the dip direction with care."
    case 'unoriented':
      return hasBeta
        ? 'This run has no usable orientation mark: alpha only, no dip direction.'
        : 'No beta: alpha only, no dip direction.'
    case 'beta-jump':
      return `Beta differs by more than ${formatAngle(ctx.betaJumpDeg, 0)} from the previous structure of this type in the run.`
    default:
      return flagLook(flag).hint
  }
}
