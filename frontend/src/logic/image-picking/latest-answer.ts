// Requests whose answers may come back out of order (fits while points are dragged, suggestions
// while the view pans): only the answer to the latest request is taken, older ones are ignored.

export interface LatestAnswer {
  /** Starts a request; returns its ticket. */
  begin(): number
  /** The ticket is still the latest: its answer may be shown. */
  isLatest(ticket: number): boolean
  /** Makes every ticket out so far stale (the draft was cleared). */
  invalidate(): void
}

export function latestAnswer(): LatestAnswer {
  let last = 0
  return {
    begin: () => ++last,
    isLatest: (ticket) => ticket === last,
    invalidate: () => void ++last,
  }
}

/**
 * Runs `request` for the latest ticket only: resolves to its answer, or to `undefined` when a
 * newer request began before it came back (the stale answer is dropped, its error too).
 */
export async function takeLatest<T>(
  guard: LatestAnswer,
  request: () => Promise<T>,
): Promise<{ value: T } | undefined> {
  const ticket = guard.begin()
  try {
    const value = await request()
    return guard.isLatest(ticket) ? { value } : undefined
  } catch (err: unknown) {
    if (guard.isLatest(ticket)) throw err
    return undefined
  }
}
