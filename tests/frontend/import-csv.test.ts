import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import { flushPromises, mount } from '@vue/test-utils'
import Select from 'primevue/select'
import ImportCsv from '../../frontend/src/components/imports/ImportCsv.vue'
import ImportCsvErrors from '../../frontend/src/components/imports/ImportCsvErrors.vue'
import {
  guessMapping,
  problemRows,
  sniffHeaders,
} from '../../frontend/src/logic/imports/import-problems'
import { setCsrfToken } from '../../frontend/src/api/client'
import { withPrimeVue } from './mount-options'

const rowErrors = [
  {
    path: 'file.line.3.alpha',
    message: 'row 2 (line 3), column alpha: Too big: expected number to be <=90',
  },
  {
    path: 'file.line.5.type',
    message: 'row 4 (line 5), column type: "jx" is not a structure type',
  },
]

describe('problemRows()', () => {
  it('splits the server details into row, line, column and reason', () => {
    expect(problemRows(rowErrors)).toEqual([
      { row: 2, line: 3, column: 'alpha', reason: 'Too big: expected number to be <=90' },
      { row: 4, line: 5, column: 'type', reason: '"jx" is not a structure type' },
    ])
    expect(
      problemRows([{ path: 'mapping.depth', message: 'column "Depth" is not in the file' }]),
    ).toEqual([
      {
        row: null,
        line: null,
        column: 'mapping: depth',
        reason: 'column "Depth" is not in the file',
      },
    ])
  })

  it('reads the header row of a semicolon file with a byte-order mark', async () => {
    const file = new File(['\uFEFFFrom;To;"Rec m"\n0;3;2.9\n'], 'runs.csv')
    await expect(sniffHeaders(file)).resolves.toEqual(['From', 'To', 'Rec m'])
    // By the field's name or its label, case and punctuation aside.
    const fields = [
      { name: 'depth', label: 'Depth' },
      { name: 'dipDirection', label: 'Dip direction (true)' },
      { name: 'infillThicknessMm', label: 'Infill mm' },
    ]
    expect(guessMapping(['DEPTH', 'dip_direction', 'Infill MM', 'x'], fields)).toEqual({
      depth: 'DEPTH',
      dipDirection: 'dip_direction',
      infillThicknessMm: 'Infill MM',
    })
  })
})

describe('ImportCsvErrors', () => {
  it('renders one table row per detail and says how many more there are', () => {
    const wrapper = mount(ImportCsvErrors, {
      props: {
        problems: {
          code: 'row_errors',
          message: '1200 row errors in the file: nothing was imported.',
          details: rowErrors,
          rowCount: 5000,
          errorCount: 1200,
        },
      },
    })
    const cells = wrapper
      .findAll('[data-testid="import-error-table"] tbody tr')
      .map((tr) => tr.findAll('td').map((td) => td.text()))
    expect(cells).toEqual([
      ['2', '3', 'alpha', 'Too big: expected number to be <=90'],
      ['4', '5', 'type', '"jx" is not a structure type'],
    ])
    expect(wrapper.get('[role="alert"]').text()).toContain(
      '5000 data rows read; nothing was stored.',
    )
    expect(wrapper.text()).toContain('… and 1198 more')
  })
})

interface Sent {
  method: string
  url: string
  form?: FormData
}

/** fetch that records multipart bodies too, answering from a queue of replies. */
function stubFetch(replies: { status: number; body: unknown }[]) {
  const sent: Sent[] = []
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: RequestInfo | URL, init: RequestInit = {}) => {
      const form = init.body instanceof FormData ? init.body : undefined
      sent.push({ method: init.method ?? 'GET', url: String(input), form })
      const reply = replies.shift() ?? { status: 500, body: {} }
      return new Response(JSON.stringify(reply.body), { status: reply.status })
    }),
  )
  return sent
}

const headers = ['depth', 'type', 'alpha', 'beta', 'jrc', 'comment']
const mapping = {
  depth: 'depth',
  type: 'type',
  alpha: 'alpha',
  beta: 'beta',
  jrc: 'jrc',
  comment: 'comment',
}
const record = (status: string, progress: number) => ({
  id: 'a6f1c2d0-0000-4000-8000-000000000001',
  kind: 'structures',
  status,
  fileName: 'structures.csv',
  rowCount: 6000,
  progress,
  message: '',
  createdAt: '2026-03-02T10:00:00Z',
  committedAt: null,
})

beforeEach(() => setCsrfToken('test-token'))
afterEach(() => {
  vi.useRealTimers()
  vi.unstubAllGlobals()
})

describe('ImportCsv', () => {
  it('shows the errors with the mapping, checks the same file again, previews, commits and follows the job', async () => {
    const sent = stubFetch([
      {
        status: 422,
        body: {
          error: {
            code: 'row_errors',
            message: '2 row errors in the file: nothing was imported.',
            details: rowErrors,
            meta: { headers, mapping, options: {}, rowCount: 6000, errorCount: 2 },
          },
        },
      },
      {
        status: 201,
        body: {
          data: {
            importId: record('previewed', 0).id,
            kind: 'structures',
            fileName: 'structures.csv',
            headers,
            mapping: { ...mapping, alpha: 'beta' },
            options: { mode: 'core', alphaConvention: 'core-axis-to-pole' },
            rowCount: 6000,
            background: true,
            sample: [
              {
                line: 2,
                depth: 5.17,
                type: 'joint',
                alpha: 61,
                beta: 119,
                computed: { dip: 41.4, dipDirection: 229.1, flags: ['poor-mark'] },
              },
            ],
            flagCounts: { 'poor-mark': 120 },
          },
        },
      },
      { status: 202, body: { data: record('queued', 0) } },
      { status: 200, body: { data: record('committing', 40) } },
      { status: 200, body: { data: record('committed', 100) } },
    ])
    vi.useFakeTimers()
    const wrapper = mount(ImportCsv, {
      props: { projectId: '1', holeId: '4', kind: 'structures' },
      ...withPrimeVue,
    })
    const file = new File(
      ['depth,type,alpha,beta,jrc,comment\n5.17,joint,29,119,5,\n'],
      'structures.csv',
    )
    const picker = wrapper.get<HTMLInputElement>('[data-testid="import-file"]')
    Object.defineProperty(picker.element, 'files', { value: [file] })
    await picker.trigger('change')
    await flushPromises()

    expect(sent[0]!.form!.get('kind')).toBe('structures')
    expect(sent[0]!.form!.has('mapping')).toBe(false)
    expect(wrapper.findAll('[data-testid="import-error-table"] tbody tr')).toHaveLength(2)
    const selects = wrapper.findAllComponents(Select)
    const alphaColumn = selects.find((s) => s.attributes('data-mapping') === 'alpha')!
    expect(alphaColumn.props('options')).toEqual([
      { value: '(none)', label: '— not in the file —' },
      ...headers.map((h) => ({ value: h, label: h })),
    ])
    alphaColumn.vm.$emit('update:modelValue', 'beta')
    selects
      .find((s) => s.attributes('data-option') === 'alphaConvention')!
      .vm.$emit('update:modelValue', 'core-axis-to-pole')
    await wrapper.get('[data-testid="import-check"]').trigger('click')
    await flushPromises()

    const again = sent[1]!.form!
    const resent = again.get('file') as File
    expect(resent.name).toBe('structures.csv')
    expect(await resent.text()).toBe(await file.text())
    expect(JSON.parse(again.get('mapping') as string)).toEqual({ ...mapping, alpha: 'beta' })
    expect(JSON.parse(again.get('options') as string)).toEqual({
      mode: 'core',
      alphaConvention: 'core-axis-to-pole',
      betaApex: 'down-hole',
      depthUnit: 'm',
    })
    expect(wrapper.get('[data-testid="import-row-count"]').text()).toBe('6000')
    expect(wrapper.get('[data-testid="import-flag-counts"]').text()).toContain('Poor mark 120')
    const sample = wrapper.findAll('[data-testid="import-sample"] tbody td').map((td) => td.text())
    expect(sample).toEqual(['2', '5.17', 'joint', '61', '119', '', '41.4°', '229.1°', 'Poor mark'])

    await wrapper.get('[data-testid="import-commit"]').trigger('click')
    await flushPromises()
    expect(sent[2]).toMatchObject({
      method: 'POST',
      url: `/api/projects/1/holes/4/imports/${record('', 0).id}/commit`,
    })
    expect(wrapper.get('[data-testid="import-progress"]').attributes('data-status')).toBe('queued')
    await vi.advanceTimersByTimeAsync(1000)
    expect(wrapper.get('[data-testid="import-progress"]').text()).toContain('40%')
    await vi.advanceTimersByTimeAsync(1000)
    expect(wrapper.get('[data-testid="import-progress"]').attributes('data-status')).toBe(
      'committed',
    )
    expect(sent.slice(3).map((s) => s.method)).toEqual(['GET', 'GET'])
    expect(wrapper.emitted('committed')).toHaveLength(1)
    await vi.advanceTimersByTimeAsync(3000)
    expect(sent).toHaveLength(5)
  })

  it('after a missing-column refusal offers the columns read from the file', async () => {
    stubFetch([
      {
        status: 400,
        body: {
          error: {
            code: 'missing_columns',
            message: 'Missing columns: fromDepth.',
            details: [
              {
                path: 'mapping.fromDepth',
                message: 'required column "fromDepth" is missing: map it to a column of the file',
              },
            ],
          },
        },
      },
    ])
    const wrapper = mount(ImportCsv, {
      props: { projectId: '1', holeId: '4', kind: 'runs', replaceCount: 50 },
      ...withPrimeVue,
    })
    const file = new File(['Top;To;Recovered;Solid;RQD\n0;3;2.9;2.5;2.1\n'], 'runs.csv')
    const picker = wrapper.get<HTMLInputElement>('[data-testid="import-file"]')
    Object.defineProperty(picker.element, 'files', { value: [file] })
    await picker.trigger('change')
    await flushPromises()
    await vi.waitFor(() =>
      expect(wrapper.find('[data-testid="import-mapping"]').exists()).toBe(true),
    )
    const from = wrapper
      .findAllComponents(Select)
      .find((s) => s.attributes('data-mapping') === 'fromDepth')!
    const choices = from.props('options') as { value: string }[]
    expect(choices.map((o) => o.value)).toEqual([
      '(none)',
      'Top',
      'To',
      'Recovered',
      'Solid',
      'RQD',
    ])
    expect(from.props('invalid')).toBe(true)
    expect(wrapper.get('[data-testid="import-error-table"] tbody td:nth-child(3)').text()).toBe(
      'mapping: fromDepth',
    )
  })
})
