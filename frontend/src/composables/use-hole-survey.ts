import { computed, ref } from 'vue'
import { getHole, getSurvey, replaceSurvey } from '../api/holes'
import { getProject } from '../api/projects'
import { isApiError } from '../api/client'
import type { Hole, LoggingProject, Station } from '../api/types'
import { useAuthStore } from '../stores/auth'
import { describeError } from '../logic/format'
import {
  newRowKey,
  rowErrors,
  rowFromStation,
  toStationInput,
  type RowErrors,
  type SurveyField,
  type SurveyRow,
  type SurveyValue,
} from '../logic/hole/survey-rows'
import { useNotFound } from './use-not-found'

/** Page state of a hole: its header, the saved survey, and the draft rows being edited. */
export function useHoleSurvey(projectId: () => string, holeId: () => string) {
  const auth = useAuthStore()
  const handleMissing = useNotFound()
  const project = ref<LoggingProject | null>(null)
  const hole = ref<Hole | null>(null)
  const stations = ref<Station[]>([])
  const rows = ref<SurveyRow[]>([])
  const dirty = ref(false)
  const loading = ref(false)
  const saving = ref(false)
  const error = ref<string | null>(null)
  /** Errors the server named by row (`stations.N.field`), keyed by row key. */
  const serverErrors = ref<Record<string, RowErrors>>({})

  const canEdit = computed(() => auth.can(projectId(), 'logger'))
  const errors = computed(() => {
    const all: Record<string, RowErrors> = {}
    for (const row of rows.value) {
      const found = { ...serverErrors.value[row.key], ...rowErrors(row, rows.value) }
      if (Object.keys(found).length) all[row.key] = found
    }
    return all
  })
  const valid = computed(() => Object.keys(errors.value).length === 0)

  function resetRows(from: Station[]) {
    stations.value = from
    rows.value = from.map(rowFromStation)
    dirty.value = false
    serverErrors.value = {}
  }

  async function load() {
    loading.value = true
    error.value = null
    try {
      const [p, h, s] = await Promise.all([
        getProject(projectId()),
        getHole(projectId(), holeId()),
        getSurvey(projectId(), holeId()),
      ])
      project.value = p
      hole.value = h
      resetRows(s)
    } catch (err: unknown) {
      if (!handleMissing(err)) error.value = describeError(err, 'The hole could not be loaded.')
    } finally {
      loading.value = false
    }
  }

  function edit(key: string, field: SurveyField, value: SurveyValue) {
    const row = rows.value.find((r) => r.key === key)
    if (!row) return
    Object.assign(row, { [field]: value })
    if (field !== 'method') Object.assign(row, { trueAzimuth: null, declinationApplied: null })
    const remaining = { ...serverErrors.value }
    delete remaining[key]
    serverErrors.value = remaining
    dirty.value = true
  }

  function add() {
    const last = rows.value.at(-1)
    rows.value.push({
      key: newRowKey(),
      stationId: null,
      depth: null,
      azimuth: null,
      azimuthReference: last?.azimuthReference ?? 'magnetic',
      plunge: null,
      method: last?.method ?? '',
      trueAzimuth: null,
      declinationApplied: null,
    })
    dirty.value = true
  }

  function remove(key: string) {
    rows.value = rows.value.filter((r) => r.key !== key)
    dirty.value = true
  }

  function discard() {
    resetRows(stations.value)
  }

  /** Sends every row with PUT: the server replaces the whole survey in one transaction. */
  async function save(): Promise<boolean> {
    if (!valid.value) return false
    saving.value = true
    error.value = null
    const sent = [...rows.value].sort((a, b) => (a.depth as number) - (b.depth as number))
    try {
      resetRows(await replaceSurvey(projectId(), holeId(), sent.map(toStationInput)))
      hole.value = await getHole(projectId(), holeId())
      return true
    } catch (err: unknown) {
      if (isApiError(err, 400)) serverErrors.value = mapDetails(err.details, sent)
      error.value = describeError(err, 'The survey could not be saved.')
      return false
    } finally {
      saving.value = false
    }
  }

  return {
    project,
    hole,
    stations,
    rows,
    dirty,
    loading,
    saving,
    error,
    errors,
    valid,
    canEdit,
    load,
    edit,
    add,
    remove,
    discard,
    save,
  }
}

function mapDetails(details: { path: string; message: string }[], sent: SurveyRow[]) {
  const mapped: Record<string, RowErrors> = {}
  for (const { path, message } of details) {
    const match = /^stations\.(\d+)\.(\w+)$/.exec(path)
    const row = match ? sent[Number(match[1])] : undefined
    if (!match || !row) continue
    mapped[row.key] = { ...mapped[row.key], [match[2] as SurveyField]: message }
  }
  return mapped
}

export type HoleSurvey = ReturnType<typeof useHoleSurvey>
