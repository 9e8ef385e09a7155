// A request sent a moment after its input stops changing (the server's fit while points are being
// dragged), whose answer is taken only if nothing newer was asked meanwhile.
import { latestAnswer } from './latest-answer'

/** Quiet time before the server is asked (ms). */
export const FIT_DEBOUNCE_MS = 250

export interface DebouncedLatest<I> {
  /** Asks for `input` after the quiet time; a newer call replaces it. */
  request(input: I): void
  /** Drops what is waiting and every answer on its way. */
  cancel(): void
}

/**
 * `send(input)` after `delayMs` of quiet; `onAnswer` / `onError` get the answer of the latest
 * request only: an answer overtaken by a newer request (or a cancel) is ignored, its error too.
 * `onBusy` follows whether the latest request is still waiting or on its way.
 */
export function debouncedLatest<I, O>(
  send: (input: I) => Promise<O>,
  handlers: {
    onAnswer: (answer: O, input: I) => void
    onError: (err: unknown, input: I) => void
    onBusy?: (busy: boolean) => void
  },
  delayMs = FIT_DEBOUNCE_MS,
): DebouncedLatest<I> {
  const guard = latestAnswer()
  let timer: ReturnType<typeof setTimeout> | null = null

  function clear() {
    if (timer) clearTimeout(timer)
    timer = null
  }

  async function fire(input: I, ticket: number) {
    try {
      const answer = await send(input)
      if (guard.isLatest(ticket)) handlers.onAnswer(answer, input)
    } catch (err: unknown) {
      if (guard.isLatest(ticket)) handlers.onError(err, input)
    } finally {
      if (guard.isLatest(ticket)) handlers.onBusy?.(false)
    }
  }

  return {
    request(input) {
      clear()
      const ticket = guard.begin()
      handlers.onBusy?.(true)
      timer = setTimeout(() => {
        timer = null
        void fire(input, ticket)
      }, delayMs)
    },
    cancel() {
      clear()
      guard.invalidate()
      handlers.onBusy?.(false)
    },
  }
}
