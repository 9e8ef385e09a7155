import { computed, ref, shallowRef } from 'vue'
import { getProject } from '../api/projects'
import { getHole } from '../api/holes'
import { isApiError } from '../api/client'
import {
  getCurve,
  listCurves,
  listDomains,
  listIntervals,
  listRuns,
  listStructures,
} from '../api/intervals'
import type { Hole, ProjectWithRole } from '../api/types'
import type {
  CurveData,
  CurveInfo,
  DepthRun,
  DepthStructure,
  Domain,
  Interval,
} from '../api/interval-types'
import { describeError } from '../logic/format'
import { useAuthStore } from '../stores/auth'
import { useNotFound } from './use-not-found'

/** A list the server may not offer yet (or not for this hole): empty on 404, never an error. */
async function optional<T>(call: Promise<T[]>): Promise<T[]> {
  try {
    return await call
  } catch (err: unknown) {
    if (isApiError(err, 404) || isApiError(err, 501)) return []
    throw err
  }
}

/** What the depth view reads: the hole, its structures, runs, LAS curves, intervals, domains. */
export function useDepthData(projectId: () => string, holeId: () => string) {
  const auth = useAuthStore()
  const handleMissing = useNotFound()
  const project = ref<ProjectWithRole | null>(null)
  const hole = ref<Hole | null>(null)
  // Thousands of rows, replaced whole: no deep reactivity needed.
  const structures = shallowRef<DepthStructure[]>([])
  const runs = shallowRef<DepthRun[]>([])
  const curves = ref<CurveInfo[]>([])
  const curveData = shallowRef<Record<number, CurveData>>({})
  const intervals = ref<Interval[]>([])
  const domains = ref<Domain[]>([])
  const loading = ref(false)
  const error = ref<string | null>(null)

  const canDefine = computed(() => auth.can(projectId(), 'engineer'))

  async function load() {
    loading.value = true
    error.value = null
    try {
      const [p, h, s, r] = await Promise.all([
        getProject(projectId()),
        getHole(projectId(), holeId()),
        listStructures(projectId(), holeId()),
        listRuns(projectId(), holeId()),
      ])
      project.value = p
      hole.value = h
      structures.value = [...s].sort((a, b) => a.depth - b.depth)
      runs.value = [...r].sort((a, b) => a.fromDepth - b.fromDepth)
      const [c, i, d] = await Promise.all([
        optional(listCurves(projectId(), holeId())),
        optional(listIntervals(projectId(), holeId())),
        optional(listDomains(projectId())),
      ])
      curves.value = c
      intervals.value = [...i].sort((a, b) => a.fromDepth - b.fromDepth)
      domains.value = d
    } catch (err: unknown) {
      if (!handleMissing(err)) error.value = describeError(err, 'The hole could not be loaded.')
    } finally {
      loading.value = false
    }
  }

  /** Fetches a curve once; a curve that cannot be read is left out with a message. */
  async function ensureCurve(id: number): Promise<void> {
    if (curveData.value[id]) return
    try {
      const data = await getCurve(projectId(), holeId(), id)
      curveData.value = { ...curveData.value, [id]: data }
    } catch (err: unknown) {
      error.value = describeError(err, 'The curve could not be read.')
    }
  }

  async function reloadIntervals() {
    intervals.value = (await optional(listIntervals(projectId(), holeId()))).sort(
      (a, b) => a.fromDepth - b.fromDepth,
    )
  }

  return {
    project,
    hole,
    structures,
    runs,
    curves,
    curveData,
    intervals,
    domains,
    loading,
    error,
    canDefine,
    load,
    ensureCurve,
    reloadIntervals,
  }
}
