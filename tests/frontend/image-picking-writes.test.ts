import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import { effectScope } from 'vue'
import { flushPromises } from '@vue/test-utils'
import { sinusoidDepthAt } from '../../orient/index'
import { setCsrfToken } from '../../frontend/src/api/client'
import type { ImagePickRecord, TracePoint } from '../../frontend/src/api/images'
import { useImagePicking } from '../../frontend/src/composables/use-image-picking'

const base = '/api/projects/1/holes/2/images/7'
const trace = { depth: 33.2, height: 0.05, troughAzimuth: 75 }
const on = (azimuth: number): TracePoint => ({ depth: sinusoidDepthAt(trace, azimuth), azimuth })

function record(id: number, points: TracePoint[], version = 1): ImagePickRecord {
  return {
    structureId: id,
    imageId: 7,
    points,
    centreDepth: trace.depth,
    heightMm: 50,
    troughAzimuth: 75,
    diameterMm: 96,
    azimuthReference: 'north',
    northReference: 'true',
    rmsMm: 0,
    suggested: false,
    structure: {
      id,
      depth: trace.depth,
      type: 'joint',
      confidence: 'high',
      comment: '',
      dip: 27.5,
      dipDirection: 75,
      flags: [],
      version,
    },
  }
}

type Reply = { status: number; body?: unknown }
interface Call {
  method: string
  url: string
  body: unknown
  key: string | undefined
}

describe('useImagePicking(): picks on their way, edits and undo', () => {
  let calls: Call[]
  let replies: Reply[]
  beforeEach(() => {
    setCsrfToken('token')
    calls = []
    replies = []
    vi.stubGlobal(
      'fetch',
      vi.fn(async (url: string, init: RequestInit = {}) => {
        const headers = (init.headers ?? {}) as Record<string, string>
        const method = init.method ?? 'GET'
        calls.push({
          method,
          url: String(url),
          body: init.body ? JSON.parse(String(init.body)) : undefined,
          key: headers['Idempotency-Key'],
        })
        const r = String(url).endsWith('/fit')
          ? { status: 500 }
          : method === 'GET'
            ? { status: 200, body: { data: [] } }
            : (replies.shift() ?? { status: 500 })
        return new Response(r.body === undefined ? null : JSON.stringify(r.body), {
          status: r.status,
        })
      }),
    )
  })
  afterEach(() => vi.unstubAllGlobals())

  function start() {
    const changed = vi.fn()
    const scope = effectScope()
    const p = scope.run(() =>
      useImagePicking(
        () => '1',
        () => '2',
        () => 7,
        changed,
      ),
    )!
    for (const a of [10, 130, 250]) p.addPoint(on(a))
    return { p, scope, changed }
  }
  const posts = () => calls.filter((c) => c.method === 'POST' && c.url === `${base}/picks`)

  it('accept() shows the pick at once, keeps it with its points when refused, resends under the same key', async () => {
    const { p, scope, changed } = start()
    replies.push({ status: 503, body: { error: { code: 'unavailable', message: 'Try later.' } } })
    expect(await p.accept({ type: 'vein', confidence: 'medium', comment: 'calcite' })).toBe(true)
    // Pending at once, the draft cleared for the next trace.
    expect(p.writes.rows.value).toHaveLength(1)
    expect(p.writes.rows.value[0]!.status).toBe('saving')
    expect(p.draft.value.points).toHaveLength(0)
    await flushPromises()
    const failed = p.writes.pending.value[0]!
    expect(failed.status).toBe('failed')
    expect(failed.message).toBe('Try later.')
    expect(failed.points).toEqual([on(10), on(130), on(250)])
    expect(posts()[0]!.body).toEqual({
      points: [on(10), on(130), on(250)],
      type: 'vein',
      confidence: 'medium',
      comment: 'calcite',
    })
    replies.push({ status: 201, body: { data: record(501, failed.points) } })
    p.writes.retry(failed.key)
    await flushPromises()
    expect(posts()).toHaveLength(2)
    expect(posts()[1]!.key).toBe(posts()[0]!.key)
    expect(p.writes.pending.value).toHaveLength(0)
    expect(p.writes.rows.value.map((r) => [r.structureId, r.status])).toEqual([[501, 'saved']])
    // The pick chosen while pending stays chosen once saved.
    expect(p.selectedKey.value).toBe('pick:501')
    expect(changed).toHaveBeenCalledTimes(1)
    scope.stop()
  })

  it('backToDraft() puts a failed pick back on the wall as the trace being drawn', async () => {
    const { p, scope } = start()
    await p.accept({ type: 'joint', confidence: null, comment: '' })
    await flushPromises()
    p.backToDraft(p.writes.pending.value[0]!.key)
    expect(p.writes.pending.value).toHaveLength(0)
    expect(p.draft.value.points).toEqual([on(10), on(130), on(250)])
    scope.stop()
  })

  it('dragPick() stores the points shifted by the drag, with the version; 409 reloads and says so', async () => {
    const { p, scope } = start()
    p.clearDraft()
    const saved = record(601, [on(0), on(120), on(240)], 3)
    p.writes.picks.value = [saved]
    replies.push({
      status: 409,
      body: { error: { code: 'stale_version', message: 'Changed meanwhile.' } },
    })
    await p.dragPick('pick:601', 0.02, false)
    expect(p.shift.value).toEqual({ key: 'pick:601', metres: 0.02 })
    await p.dragPick('pick:601', 0.02, true)
    await flushPromises()
    const patch = calls.find((c) => c.method === 'PATCH')!
    expect(patch.url).toBe(`${base}/picks/601`)
    expect(patch.body).toEqual({
      points: saved.points.map((q) => ({ depth: q.depth + 0.02, azimuth: q.azimuth })),
      version: 3,
    })
    expect(p.writes.notes.value['pick:601']).toMatch(/changed this pick/)
    expect(calls.filter((c) => c.method === 'GET' && c.url === `${base}/picks`)).toHaveLength(1)
    expect(p.shift.value).toBeNull()
    scope.stop()
  })

  it('remove() deletes with the version; undoDelete() posts the same pick again until the next write', async () => {
    const { p, scope } = start()
    p.clearDraft()
    const saved = record(701, [on(0), on(120), on(240)], 2)
    p.writes.picks.value = [saved]
    p.selectedKey.value = 'pick:701'
    replies.push({ status: 204 })
    expect(await p.remove(701)).toBe(true)
    expect(calls.at(-1)!.url).toBe(`${base}/picks/701?version=2`)
    expect(p.selectedKey.value).toBeNull()
    expect(p.writes.deleted.value?.structureId).toBe(701)
    // A new point is the next action: the offer ends.
    p.addPoint(on(5))
    expect(p.writes.deleted.value).toBeNull()
    p.undoDelete()
    expect(posts()).toHaveLength(0)
    scope.stop()
  })

  it('undoDelete() right after the delete brings it back with its type, rating and points', async () => {
    const { p, scope } = start()
    p.clearDraft()
    p.writes.picks.value = [record(801, [on(0), on(120), on(240)])]
    replies.push({ status: 204 })
    await p.remove(801)
    replies.push({ status: 201, body: { data: record(802, [on(0), on(120), on(240)]) } })
    p.undoDelete()
    await flushPromises()
    expect(posts()[0]!.body).toEqual({
      points: [on(0), on(120), on(240)],
      type: 'joint',
      confidence: 'high',
    })
    expect(posts()[0]!.key).toBeTruthy()
    expect(p.writes.picks.value.map((r) => r.structureId)).toEqual([802])
    scope.stop()
  })
})
