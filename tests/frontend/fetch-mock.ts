import { vi } from 'vitest'

export interface Call {
  url: string
  method: string
  headers: Record<string, string>
  body: unknown
  credentials: RequestCredentials | undefined
}

type Reply = { status?: number; body?: unknown }

/** Replaces global fetch; `route` answers each call, every call is recorded. */
export function mockFetch(route: (call: Call) => Reply) {
  const calls: Call[] = []
  const fetchMock = vi.fn(async (input: RequestInfo | URL, init: RequestInit = {}) => {
    const call: Call = {
      url: String(input),
      method: init.method ?? 'GET',
      headers: { ...(init.headers as Record<string, string>) },
      body: typeof init.body === 'string' ? JSON.parse(init.body) : undefined,
      credentials: init.credentials,
    }
    calls.push(call)
    const { status = 200, body } = route(call)
    return new Response(body === undefined ? null : JSON.stringify(body), {
      status,
      headers: { 'Content-Type': 'application/json' },
    })
  })
  vi.stubGlobal('fetch', fetchMock)
  return calls
}
