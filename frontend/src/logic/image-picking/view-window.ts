// The depth window of the picking view: zoom, pan and jump inside the image, never closer than
// 1:5. A scale 1:N means one metre on screen is N metres of hole.

/** [top, bottom] in metres along hole. */
export type DepthWindow = readonly [number, number]

/** A CSS pixel is 1/96 inch (W3C CSS Values and Units, "absolute lengths"). */
export const CSS_PX_M = 0.0254 / 96
/** The closest zoom: 1:5. */
export const CLOSEST_SCALE = 5
/** The scale an image opens at, where it is long enough (1:20). */
export const OPENING_SCALE = 20

/** N of the 1:N scale at which `window` fills `heightPx` CSS pixels. */
export const scaleOf = (w: DepthWindow, heightPx: number) => (w[1] - w[0]) / (heightPx * CSS_PX_M)

const spanAt = (scale: number, heightPx: number) => scale * heightPx * CSS_PX_M

/** Keeps a window of its span inside [top, bottom]; a span longer than the image shows it all. */
function clampInto(from: number, span: number, extent: DepthWindow): DepthWindow {
  const whole = extent[1] - extent[0]
  if (span >= whole) return [extent[0], extent[1]]
  const start = Math.min(Math.max(from, extent[0]), extent[1] - span)
  return [start, start + span]
}

/** The opening window: the top of the image at 1:20, or the whole image if shorter. */
export function openingWindow(extent: DepthWindow, heightPx: number): DepthWindow {
  return clampInto(extent[0], spanAt(OPENING_SCALE, heightPx), extent)
}

/**
 * Zooms by `factor` (< 1 closer) keeping `at` where it is on screen; the span stays between 1:5
 * and the whole image.
 */
export function zoomWindow(
  w: DepthWindow,
  at: number,
  factor: number,
  extent: DepthWindow,
  heightPx: number,
): DepthWindow {
  const span = w[1] - w[0]
  const next = Math.min(
    Math.max(span * factor, spanAt(CLOSEST_SCALE, heightPx)),
    extent[1] - extent[0],
  )
  const f = span > 0 ? (at - w[0]) / span : 0.5
  return clampInto(at - f * next, next, extent)
}

export const panWindow = (w: DepthWindow, metres: number, extent: DepthWindow) =>
  clampInto(w[0] + metres, w[1] - w[0], extent)

/** Centres the window on `depth` (go to depth). */
export const centreWindow = (w: DepthWindow, depth: number, extent: DepthWindow) =>
  clampInto(depth - (w[1] - w[0]) / 2, w[1] - w[0], extent)

/** Pans just enough to bring `depth` back inside, with a margin of a tenth of the span. */
export function followDepth(w: DepthWindow, depth: number, extent: DepthWindow): DepthWindow {
  const span = w[1] - w[0]
  const margin = span / 10
  if (depth < w[0] + margin) return clampInto(depth - margin, span, extent)
  if (depth > w[1] - margin) return clampInto(depth + margin - span, span, extent)
  return w
}
