// Depths the grid suggests, and the hole's final depth as the end of what can be logged.

/** A depth written back into a cell: millimetres at most, without float noise (0.1 + 0.2). */
export const depthText = (depth: number) => String(Math.round(depth * 1000) / 1000)

/**
 * The next row's depth: one step deeper, but never past the hole's final depth. At the final depth
 * itself nothing deeper is suggested ('').
 */
export function suggestDepth(from: number, step: number, finalDepth: number | undefined): string {
  const next = Math.round((from + step) * 1000) / 1000
  if (finalDepth === undefined || next <= finalDepth) return depthText(next)
  return from < finalDepth ? depthText(finalDepth) : ''
}

/** The note for a typed depth below the end of the hole, or null when the depth is within it. */
export function beyondFinalDepth(depth: number, finalDepth: number | undefined): string | null {
  if (finalDepth === undefined || depth <= finalDepth) return null
  return `depth ${depthText(depth)} m is beyond the hole's final depth (${depthText(finalDepth)} m): extend the hole's final depth first`
}
