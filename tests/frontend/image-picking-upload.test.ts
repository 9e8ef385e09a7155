import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import { effectScope } from 'vue'
import { flushPromises, mount } from '@vue/test-utils'
import ImageUploadForm from '../../frontend/src/components/image/ImageUploadForm.vue'
import { setCsrfToken } from '../../frontend/src/api/client'
import type { ImageMeta } from '../../frontend/src/api/images'
import { POLL_MS, useHoleImages } from '../../frontend/src/composables/use-hole-images'
import { withPrimeVue } from './mount-options'

const meta = (id: number, status: ImageMeta['status'], progress = 100) =>
  ({ id, name: `img-${id}`, status, progress, createdAt: `2026-04-0${id}T00:00:00Z` }) as ImageMeta

type Reply = { status: number; body?: unknown }
let sent: { method: string; url: string; form: FormData | null }[]
let replies: Reply[]
let listed: ImageMeta[]

beforeEach(() => {
  setCsrfToken('token')
  sent = []
  replies = []
  listed = []
  vi.stubGlobal(
    'fetch',
    vi.fn(async (url: string, init: RequestInit = {}) => {
      const method = init.method ?? 'GET'
      sent.push({ method, url, form: init.body instanceof FormData ? init.body : null })
      const r: Reply =
        method === 'GET' && url.endsWith('/images')
          ? { status: 200, body: { data: listed } }
          : (replies.shift() ?? { status: 500 })
      return new Response(r.body === undefined ? null : JSON.stringify(r.body), {
        status: r.status,
      })
    }),
  )
})
afterEach(() => {
  vi.useRealTimers()
  vi.unstubAllGlobals()
})

const png = new File([new Uint8Array([137, 80, 78, 71])], 'gsq-bh02-atv.png', { type: 'image/png' })
const posts = () => sent.filter((s) => s.method === 'POST')

describe('useHoleImages(): upload, refusals, duplicates and progress', () => {
  it('a file stored before is warned of (409) and sent again only with confirmDuplicate', async () => {
    const scope = effectScope()
    const s = scope.run(() =>
      useHoleImages(
        () => '1',
        () => '2',
      ),
    )!
    s.setDraft({ ...s.draft.value, file: png, topDepth: 126, bottomDepth: 129 })
    replies.push({
      status: 409,
      body: { error: { code: 'duplicate_image', message: 'The same file is already here.' } },
    })
    await s.submit()
    expect(s.duplicate.value).toBe('The same file is already here.')
    expect(posts()[0]!.form!.get('confirmDuplicate')).toBeNull()
    expect(posts()[0]!.form!.get('topDepth')).toBe('126')
    expect(posts()[0]!.form!.get('northReference')).toBe('magnetic')
    listed = [meta(5, 'ready')]
    replies.push({ status: 201, body: { data: meta(5, 'ready') } })
    await s.submit(true)
    expect(posts()[1]!.form!.get('confirmDuplicate')).toBe('true')
    expect(s.duplicate.value).toBeNull()
    expect(s.draft.value.file).toBeNull()
    expect(s.images.value.map((i) => i.id)).toEqual([5])
    scope.stop()
  })

  it('polls an image being tiled until it is ready, then stops', async () => {
    vi.useFakeTimers()
    listed = [meta(3, 'processing', 10)]
    const scope = effectScope()
    const s = scope.run(() =>
      useHoleImages(
        () => '1',
        () => '2',
      ),
    )!
    await s.load()
    replies.push({ status: 200, body: { data: meta(3, 'processing', 60) } })
    await vi.advanceTimersByTimeAsync(POLL_MS)
    expect(s.images.value[0]!.progress).toBe(60)
    replies.push({ status: 200, body: { data: { ...meta(3, 'failed'), message: 'Bad rows.' } } })
    await vi.advanceTimersByTimeAsync(POLL_MS)
    expect(s.images.value[0]!.status).toBe('failed')
    const gets = sent.filter((c) => c.url.endsWith('/images/3')).length
    await vi.advanceTimersByTimeAsync(POLL_MS * 5)
    expect(sent.filter((c) => c.url.endsWith('/images/3')).length).toBe(gets)
    scope.stop()
  })
})

describe('ImageUploadForm: every refusal next to its field', () => {
  it("shows the browser's and then the server's refusals under the fields they name", async () => {
    const scope = effectScope()
    const images = scope.run(() =>
      useHoleImages(
        () => '1',
        () => '2',
      ),
    )!
    const wrapper = mount(ImageUploadForm, { props: { images, coreSize: 'HQ3' }, ...withPrimeVue })
    expect(wrapper.get('#image-diameter').attributes('placeholder')).toBe('96 (nominal HQ3)')
    await wrapper.get('form').trigger('submit')
    expect(wrapper.get('[data-testid="image-error-file"]').text()).toBe('Choose a file.')
    images.setDraft({ ...images.draft.value, file: png, topDepth: 126, bottomDepth: 129 })
    replies.push({
      status: 400,
      body: {
        error: {
          code: 'invalid_input',
          message: 'Invalid input',
          details: [{ path: 'body.diameterMm', message: 'Number must be at least 20' }],
        },
      },
    })
    await wrapper.get('form').trigger('submit')
    await flushPromises()
    expect(wrapper.get('[data-testid="image-error-diameterMm"]').text()).toBe(
      'Number must be at least 20',
    )
    expect(wrapper.find('[data-testid="image-error-file"]').exists()).toBe(false)
    wrapper.unmount()
    scope.stop()
  })
})
