// Device pixels per CSS pixel, followed as it changes (a window moved to another screen, a zoom).

/** Calls `onChange` with the new ratio whenever it changes; returns the function that stops it. */
export function watchPixelRatio(onChange: (ratio: number) => void): () => void {
  if (typeof window === 'undefined' || !window.matchMedia) return () => {}
  let media: MediaQueryList | null = null
  const listen = () => {
    // A media query matches one ratio only: once it stops matching, listen for the new one.
    media = window.matchMedia(`(resolution: ${window.devicePixelRatio || 1}dppx)`)
    media.addEventListener('change', changed, { once: true })
  }
  const changed = () => {
    onChange(window.devicePixelRatio || 1)
    listen()
  }
  listen()
  return () => media?.removeEventListener('change', changed)
}
