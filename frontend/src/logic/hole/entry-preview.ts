// The live preview of a row being typed: orient's computeStructures, the function the server runs
// on save, with the hole's survey and runs and the project's conventions.
import {
  computeStructures,
  type ComputeContext,
  type StructureComputed,
  type StructureInputs,
  storedInputs as orientStoredInputs,
} from '../../../../orient/index'
import type { Hole, LoggingProject, Run, Station, Structure, StructureInput } from '../../api/types'

/** The server's default when a project predates the setting (schema/projects.ts). */
const DEFAULT_BETA_JUMP = 60

export function computeContext(
  project: LoggingProject,
  hole: Hole,
  stations: readonly Station[],
  runs: readonly Run[],
): ComputeContext {
  return {
    steepThresholdDeg: project.steepThresholdDeg,
    betaJumpDeg: project.betaJumpDeg ?? DEFAULT_BETA_JUMP,
    referenceLine: project.referenceLine,
    collar: { east: hole.collarEast, north: hole.collarNorth, elevation: hole.collarElevation },
    planned: { trend: hole.plannedAzimuth, plunge: hole.plannedPlunge },
    stations: [...stations]
      .sort((a, b) => a.depth - b.depth)
      .map((s) => ({
        depth: s.depth,
        azimuth: s.azimuth,
        plunge: s.plunge,
        declinationApplied: s.declinationApplied,
      })),
    runs: [...runs]
      .sort((a, b) => a.fromDepth - b.fromDepth)
      .map((r) => ({
        fromDepth: r.fromDepth,
        toDepth: r.toDepth,
        markConfidence: r.markConfidence,
        betaRotation: r.betaRotation ?? 0,
      })),
  }
}

/** A stored row as the server feeds it to computeStructures (the same orient helper). */
export function storedInputs(s: Structure): StructureInputs {
  return orientStoredInputs(s)
}

function draftInputs(input: StructureInput): StructureInputs {
  return {
    depth: input.depth,
    type: input.type,
    source: input.source ?? 'core',
    alpha: input.alpha,
    beta: input.beta,
    referenceLine: input.referenceLine,
    inputDip: input.dip,
    inputDipDirection: input.dipDirection,
  }
}

/**
 * The draft's computed values. Beta jumps compare with the previous structure of the same type in
 * the same run, so the saved rows of that run go in too, in the server's order (depth, then id);
 * rows still in the save queue sort after the saved ones (the server will give them the next ids),
 * a new row after those, and an edited row keeps its id.
 */
export function previewStructure(
  ctx: ComputeContext,
  saved: readonly Structure[],
  input: StructureInput,
  editingId?: number,
  queued: readonly StructureInput[] = [],
): StructureComputed {
  const run = ctx.runs.find((r) => input.depth >= r.fromDepth && input.depth < r.toDepth)
  const inRun = (depth: number) => !!run && depth >= run.fromDepth && depth < run.toDepth
  const draftId = editingId ?? Number.POSITIVE_INFINITY
  const queuedFrom = Number.MAX_SAFE_INTEGER - queued.length
  const items = [
    ...saved
      .filter((s) => s.id !== editingId && inRun(s.depth))
      .map((s) => ({ id: s.id, inputs: storedInputs(s) })),
    ...queued
      .map((q, i) => ({ id: queuedFrom + i, inputs: draftInputs(q) }))
      .filter((q) => inRun(q.inputs.depth)),
    { id: draftId, inputs: draftInputs(input) },
  ].sort((a, b) => a.inputs.depth - b.inputs.depth || a.id - b.id)
  const computed = computeStructures(
    ctx,
    items.map((i) => i.inputs),
  )
  return computed[items.findIndex((i) => i.id === draftId)]!
}
