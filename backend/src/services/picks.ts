import {
  highSideFromNorth,
  prepareSurvey,
  wrap360,
  type StoredStructure,
} from '../../../orient/index'
import { structures, type Hole, type Project } from '../../../schema/index'
import type { Executor } from '../db/client'
import type { StructureInputRow } from '../db/structure-columns'
import type { PickImportOptionsT, PickRow } from '../imports/kinds/picks'
import { declinationFor } from './declination'
import type { ComputeContext } from '../../../orient/index'

/** A pick as inserted: its inputs only; the recompute that follows writes the computed columns. */
type NewPick = StoredStructure & StructureInputRow

/**
 * Picks as stored structures (source image), with the raw sinusoid kept. Magnetic-north image
 * azimuths are referred to true north once, here: trough_true = trough_mag − a_mag + a_true, where
 * a is the angle from projected (magnetic or true) north to the high side in the hole's own frame
 * — not simply + declination, which only holds for vertical holes.
 */
export function picksToStructures(
  ctx: ComputeContext,
  project: Project,
  hole: Hole,
  rows: PickRow[],
  options: PickImportOptionsT,
): NewPick[] {
  const survey = prepareSurvey(ctx.stations)
  const declination =
    options.azimuthReference === 'north' && options.northReference === 'magnetic'
      ? declinationFor(project, hole, hole.startDate ? new Date(hole.startDate) : new Date())
      : 0
  return rows.map((r) => {
    let trough = r.troughAzimuth
    if (declination !== 0) {
      const axis = survey.holeAt(r.depth) ?? ctx.planned
      const toHighTrue = highSideFromNorth(axis)
      const toHighMag = highSideFromNorth({
        trend: wrap360(axis.trend - declination),
        plunge: axis.plunge,
      })
      if (toHighTrue !== undefined && toHighMag !== undefined)
        trough = wrap360(trough - toHighMag + toHighTrue)
    }
    return {
      holeId: hole.id,
      depth: r.depth,
      type: r.type,
      source: 'image' as const,
      alpha: null,
      beta: null,
      referenceLine: null,
      inputDip: null,
      inputDipDirection: null,
      pickAmplitude: r.amplitude,
      pickDiameter: r.diameter,
      pickTroughAzimuth: trough,
      pickReference: options.azimuthReference === 'north' ? 'north' : 'highside',
      pickAzimuthReference:
        options.azimuthReference === 'north' ? `north-${options.northReference}` : 'highside',
      pickQuality: r.quality ?? null,
      comment: r.comment ?? '',
    }
  })
}

/** Inserts picks in chunks inside the caller's transaction; the caller then recomputes the hole. */
export async function insertPicks(tx: Executor, rows: NewPick[], importId: string, userId: number) {
  for (let i = 0; i < rows.length; i += 1000) {
    await tx
      .insert(structures)
      .values(
        rows
          .slice(i, i + 1000)
          .map((r) => ({ ...r, importId, createdBy: userId, updatedBy: userId })),
      )
  }
}
