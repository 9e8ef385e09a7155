import { computed, reactive, watch, type Ref } from 'vue'
import { analysisSettingKeys, type AnalysisSettingKey } from '../../../schema/vocabulary'
import type { AnalysisSettings, Interval } from '../api/interval-types'

/** The settings part of an interval row. */
export function settingsOf(i: AnalysisSettings): AnalysisSettings {
  return {
    weighting: i.weighting,
    contourMethod: i.contourMethod,
    faceDip: i.faceDip,
    faceDipDirection: i.faceDipDirection,
    frictionDeg: i.frictionDeg,
    lateralLimitDeg: i.lateralLimitDeg,
    topplingLimitDeg: i.topplingLimitDeg,
  }
}

/**
 * The settings the interval view explores with, starting from the interval's saved ones. They
 * return to the saved settings whenever the interval itself changes (another interval, or a new
 * version: saved, checked, approved, reopened), never when only the analysis reloads.
 */
export function useIntervalSettings(interval: Ref<Interval | null>) {
  const explore = reactive<AnalysisSettings>({
    weighting: 'terzaghi',
    contourMethod: 'kamb',
    faceDip: null,
    faceDipDirection: null,
    frictionDeg: null,
    lateralLimitDeg: 20,
    topplingLimitDeg: 30,
  })
  const saved = computed(() => (interval.value ? settingsOf(interval.value) : null))

  watch(
    () => (interval.value ? `${interval.value.id}@${interval.value.version}` : ''),
    (key) => key && reset(),
    { immediate: true },
  )

  function reset() {
    if (saved.value) Object.assign(explore, saved.value)
  }

  /** The settings shown that are not the saved ones (none until the interval is known). */
  const differences = computed<AnalysisSettingKey[]>(() => {
    const s = saved.value
    return s ? analysisSettingKeys.filter((k) => explore[k] !== s[k]) : []
  })

  /** What the analysis request sends: only the differing settings (none = the saved ones). */
  const overrides = computed<Partial<AnalysisSettings>>(() =>
    Object.fromEntries(differences.value.map((k) => [k, explore[k]])),
  )

  /** Applies some explored values at once (the kinematic form's face, friction and limits). */
  function apply(values: Partial<AnalysisSettings>) {
    Object.assign(explore, values)
  }

  return { explore, saved, differences, overrides, reset, apply }
}
