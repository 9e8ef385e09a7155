import { ref, watch, type Ref } from 'vue'

/**
 * A copy of `source` that follows it once per painted frame at most: a change is taken up after the
 * next paint, and changes arriving meanwhile are merged. Views that are slow to redraw (the linked
 * net, with its density contours) read the copy, so a dragged brush keeps moving every frame while
 * they catch up.
 */
export function useDepthFollow<T>(source: Ref<T>): Ref<T> {
  const copy = ref(source.value) as Ref<T>
  let waiting = false
  const afterPaint = (fn: () => void) =>
    typeof requestAnimationFrame === 'function'
      ? requestAnimationFrame(() => setTimeout(fn, 0))
      : setTimeout(fn, 0)
  watch(source, () => {
    if (waiting) return
    waiting = true
    afterPaint(() => {
      waiting = false
      copy.value = source.value
    })
  })
  return copy
}
