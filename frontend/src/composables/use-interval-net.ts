import { computed, ref, watch, type Ref, type ShallowRef } from 'vue'
import type { Analysis, AnalysisSettings } from '../api/interval-types'
import type { NetProjection } from '../logic/net/net-geometry'
import type { DensityMethod } from '../logic/net/net-contours'
import type { ZoneMode } from '../logic/net/net-kinematic-zones'
import { setColour } from '../logic/net/set-palette'
import type * as T from '../logic/net/net-types'

/**
 * What the interval's net draws, from the server's analysis, and the display choices around it:
 * projection, poles or great circles, contours, the kinematic zone, the tool and the selection.
 * The contour method and the weighting are the explored analysis settings (they start from the
 * interval's saved ones); hiding the contours is a display choice only.
 */
export function useIntervalNet(
  analysis: ShallowRef<Analysis | null>,
  defaultProjection: Ref<NetProjection | undefined>,
  settings: AnalysisSettings,
) {
  const projection = ref<NetProjection>('equal-area')
  const display = ref<T.NetDisplay>('poles')
  const showContours = ref(true)
  const method = computed<DensityMethod | 'none'>({
    get: () => (showContours.value ? settings.contourMethod : 'none'),
    set: (m) => {
      showContours.value = m !== 'none'
      if (m !== 'none') settings.contourMethod = m
    },
  })
  const weighted = computed<boolean>({
    get: () => settings.weighting === 'terzaghi',
    set: (w) => {
      settings.weighting = w ? 'terzaghi' : 'none'
    },
  })
  const zoneMode = ref<ZoneMode | 'none'>('planar')
  const tool = ref<T.NetTool>('inspect')
  const selected = ref<number[]>([])
  const highlight = ref<number | null>(null)
  const blindAngle = ref(15)

  watch(defaultProjection, (p) => p && (projection.value = p), { immediate: true })

  const setIndex = computed(
    () => new Map((analysis.value?.sets ?? []).map((s, i) => [s.id, i] as [number, number])),
  )

  const poles = computed<T.NetPole[]>(() =>
    (analysis.value?.structures ?? []).flatMap((s) =>
      s.poleTrend === null || s.polePlunge === null || s.dip === null || s.dipDirection === null
        ? []
        : [
            {
              id: s.id,
              trend: s.poleTrend,
              plunge: s.polePlunge,
              dip: s.dip,
              dipDirection: s.dipDirection,
              group: s.setId === null ? -1 : (setIndex.value.get(s.setId) ?? -1),
              flagged: s.flags.length > 0,
              weight: s.terzaghiWeight ?? 1,
            },
          ],
    ),
  )

  const sets = computed<T.NetSetMark[]>(() =>
    (analysis.value?.sets ?? []).map((s, i) => ({
      id: s.id,
      name: s.name,
      colour: setColour(i),
      centre: { trend: s.centreTrend, plunge: s.centrePlunge },
      coneAngle: s.coneAngle,
      meanPole: s.meanPole,
      alpha95: s.alpha95,
      uncertainty95: s.uncertainty95 ?? null,
    })),
  )

  const intersections = computed<T.NetIntersectionMark[]>(() =>
    (analysis.value?.intersections ?? []).flatMap((i) =>
      i.trend === null || i.plunge === null
        ? []
        : [
            {
              key: `${i.setA}-${i.setB}`,
              label: `${i.nameA} × ${i.nameB}`,
              trend: i.trend,
              plunge: i.plunge,
            },
          ],
    ),
  )

  const zone = computed<T.NetZone | null>(() => {
    const k = analysis.value?.kinematics
    if (!k || zoneMode.value === 'none') return null
    return {
      mode: zoneMode.value,
      face: k.face,
      friction: k.friction,
      lateralLimit: k.lateralLimit,
      topplingLimit: k.topplingLimit,
    }
  })

  const contours = computed<T.NetContourSettings | null>(() =>
    method.value === 'none'
      ? null
      : { method: method.value, step: 'auto', weighted: weighted.value },
  )

  const hole = computed(() => analysis.value?.hole ?? null)

  return {
    projection,
    display,
    method,
    weighted,
    zoneMode,
    tool,
    selected,
    highlight,
    blindAngle,
    poles,
    sets,
    intersections,
    zone,
    contours,
    hole,
  }
}
