import { coneScratch } from './uncertainty-cone'
import { holePlan } from './uncertainty-hole'
import type { ConeScratch } from './uncertainty-cone'
import type { DrawTables } from './uncertainty-draws'
import type { HolePlan } from './uncertainty-hole'

/**
 * Per-structure scratch of the source loops (uncertainty-core.ts, uncertainty-image.ts,
 * uncertainty-true.ts), reused from one structure to the next: each loop writes its computed
 * (undisturbed) pole to n0 and fills cone (|cos| of each draw's pole to n0, and Σ n nᵀ).
 */
export interface SourceScratch {
  readonly cone: ConeScratch
  readonly plan: HolePlan
  readonly n0: Float64Array
}

export function sourceScratch(t: DrawTables): SourceScratch {
  return { cone: coneScratch(t.draws), plan: holePlan(t), n0: new Float64Array(3) }
}
