import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import { effectScope, nextTick } from 'vue'
import { flushPromises } from '@vue/test-utils'
import { sinusoidDepthAt } from '../../orient/index'
import { setCsrfToken } from '../../frontend/src/api/client'
import { useImagePicking } from '../../frontend/src/composables/use-image-picking'
import {
  debouncedLatest,
  FIT_DEBOUNCE_MS,
} from '../../frontend/src/logic/image-picking/debounced-latest'
import { latestAnswer, takeLatest } from '../../frontend/src/logic/image-picking/latest-answer'

/** A promise the test resolves or rejects when it chooses. */
function later<T>() {
  let resolve!: (v: T) => void
  let reject!: (e: unknown) => void
  const promise = new Promise<T>((res, rej) => ((resolve = res), (reject = rej)))
  return { promise, resolve, reject }
}

describe('debouncedLatest(): the server fit while points move', () => {
  beforeEach(() => vi.useFakeTimers())
  afterEach(() => vi.useRealTimers())

  it('sends once after the quiet time, with the newest input', async () => {
    const send = vi.fn(async (n: number) => n * 10)
    const onAnswer = vi.fn()
    const d = debouncedLatest(send, { onAnswer, onError: vi.fn() })
    d.request(1)
    d.request(2)
    await vi.advanceTimersByTimeAsync(FIT_DEBOUNCE_MS - 1)
    d.request(3)
    expect(send).not.toHaveBeenCalled()
    await vi.advanceTimersByTimeAsync(FIT_DEBOUNCE_MS)
    expect(send).toHaveBeenCalledTimes(1)
    expect(send).toHaveBeenCalledWith(3)
    expect(onAnswer).toHaveBeenCalledWith(30, 3)
  })

  it('ignores an answer that comes back after a newer request was sent, its error too', async () => {
    const answers = [later<string>(), later<string>(), later<string>()]
    let n = 0
    const send = vi.fn(() => answers[n++]!.promise)
    const onAnswer = vi.fn()
    const onError = vi.fn()
    const busy: boolean[] = []
    const d = debouncedLatest(send, { onAnswer, onError, onBusy: (b) => busy.push(b) })
    d.request('three points')
    await vi.advanceTimersByTimeAsync(FIT_DEBOUNCE_MS)
    d.request('four points')
    await vi.advanceTimersByTimeAsync(FIT_DEBOUNCE_MS)
    d.request('five points')
    await vi.advanceTimersByTimeAsync(FIT_DEBOUNCE_MS)
    answers[2]!.resolve('fit of five')
    answers[0]!.resolve('fit of three')
    answers[1]!.reject(new Error('late failure'))
    await vi.runAllTimersAsync()
    expect(onAnswer).toHaveBeenCalledTimes(1)
    expect(onAnswer).toHaveBeenCalledWith('fit of five', 'five points')
    expect(onError).not.toHaveBeenCalled()
    expect(busy.at(-1)).toBe(false)
  })

  it('cancel() drops what waits and what is on its way', async () => {
    const answer = later<string>()
    const onAnswer = vi.fn()
    const d = debouncedLatest(() => answer.promise, { onAnswer, onError: vi.fn() })
    d.request('a')
    await vi.advanceTimersByTimeAsync(FIT_DEBOUNCE_MS)
    d.cancel()
    answer.resolve('too late')
    await vi.runAllTimersAsync()
    expect(onAnswer).not.toHaveBeenCalled()
  })

  it('takeLatest() resolves the latest request only', async () => {
    const guard = latestAnswer()
    const first = later<number>()
    const second = later<number>()
    const a = takeLatest(guard, () => first.promise)
    const b = takeLatest(guard, () => second.promise)
    first.resolve(1)
    second.resolve(2)
    expect(await a).toBeUndefined()
    expect(await b).toEqual({ value: 2 })
  })
})

describe('useImagePicking(): live fit in the browser, server fit debounced', () => {
  const trace = { depth: 31.4, height: 0.06, troughAzimuth: 210 }
  const on = (azimuth: number) => ({ depth: sinusoidDepthAt(trace, azimuth), azimuth })
  let fits: { points: unknown[]; answer: ReturnType<typeof later<Response>> }[] = []

  beforeEach(() => {
    vi.useFakeTimers()
    setCsrfToken('token')
    fits = []
    vi.stubGlobal(
      'fetch',
      vi.fn((url: string, init: RequestInit = {}) => {
        if (String(url).endsWith('/fit')) {
          const answer = later<Response>()
          fits.push({ points: JSON.parse(String(init.body)).points, answer })
          return answer.promise
        }
        return Promise.resolve(new Response(JSON.stringify({ data: [] }), { status: 200 }))
      }),
    )
  })
  afterEach(() => {
    vi.useRealTimers()
    vi.unstubAllGlobals()
  })
  const reply = (dip: number) =>
    new Response(
      JSON.stringify({
        data: { depth: 31.4, height: 60, troughAzimuth: 210, rmsMm: 0, dip, dipDirection: 100 },
      }),
      { status: 200 },
    )

  it('shows the browser fit at once and only the answer to the latest points', async () => {
    const scope = effectScope()
    const p = scope.run(() =>
      useImagePicking(
        () => '1',
        () => '2',
        () => 7,
      ),
    )!
    p.addPoint(on(0))
    p.addPoint(on(120))
    expect(p.liveFit.value).toBeUndefined()
    p.addPoint(on(240))
    // The browser's fit is there before the server is asked.
    expect(p.liveFit.value!.depth).toBeCloseTo(trace.depth, 9)
    expect(p.liveFit.value!.height).toBeCloseTo(trace.height, 9)
    await nextTick()
    await vi.advanceTimersByTimeAsync(FIT_DEBOUNCE_MS)
    expect(fits).toHaveLength(1)
    p.addPoint(on(300))
    await nextTick()
    await vi.advanceTimersByTimeAsync(FIT_DEBOUNCE_MS)
    expect(fits).toHaveLength(2)
    expect(fits[1]!.points).toHaveLength(4)
    fits[1]!.answer.resolve(reply(40))
    await flushPromises()
    fits[0]!.answer.resolve(reply(12))
    await flushPromises()
    expect(p.serverFit.value?.dip).toBe(40)
    expect(p.fitBusy.value).toBe(false)
    // Back under three points: no fit shown, and a late answer would not bring one back.
    p.dropPoint()
    p.dropPoint()
    await nextTick()
    expect(p.serverFit.value).toBeNull()
    scope.stop()
  })
})
