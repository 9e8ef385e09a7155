/**
 * A project's measurement error model: one standard deviation (1σ) of each input that a computed
 * orientation depends on. The Monte Carlo propagation (uncertainty.ts) draws from it.
 *
 * Defaults are typical field figures, common practice (from memory), to be replaced by the
 * project's own: magnetic single/multi-shot tools read azimuth to about ±1–2° and north-seeking
 * gyros to about ±0.5° (azimuth readings degrade near vertical); inclination to about ±0.2°;
 * alpha on a protractor or core goniometer to about ±2° and beta, read against a drawn line, to
 * about ±5°; a sinusoid picked on a 4 mm-row image to about ±3 mm in height and ±3° in trough
 * azimuth; a compass-clinometer reading to ±2° dip and ±3° dip direction; depths along hole to
 * about ±0.05 m.
 */
export interface ErrorModel {
  /** Survey azimuth, magnetic instruments (degrees). */
  readonly surveyAzimuthSdMagnetic: number
  /** Survey azimuth, gyroscopic instruments (degrees). */
  readonly surveyAzimuthSdGyro: number
  /** Survey inclination (degrees). */
  readonly surveyInclinationSd: number
  /** Alpha reading on core (degrees). */
  readonly alphaSd: number
  /** Beta reading on core (degrees). */
  readonly betaSd: number
  /** Image pick: peak-to-trough height (mm). */
  readonly pickHeightSdMm: number
  /** Image pick: trough azimuth (degrees). */
  readonly pickTroughSd: number
  /** Orientation entered as measured (compass): dip (degrees). */
  readonly trueDipSd: number
  /** Orientation entered as measured (compass): dip direction (degrees). */
  readonly trueDipDirectionSd: number
  /** Depth along hole (m). */
  readonly depthSd: number
}

export const DEFAULT_ERROR_MODEL: ErrorModel = Object.freeze({
  surveyAzimuthSdMagnetic: 1.5,
  surveyAzimuthSdGyro: 0.5,
  surveyInclinationSd: 0.2,
  alphaSd: 2,
  betaSd: 5,
  pickHeightSdMm: 3,
  pickTroughSd: 3,
  trueDipSd: 2,
  trueDipDirectionSd: 3,
  depthSd: 0.05,
})

/** A survey instrument class, by what the station's method says (gyro) or its reference. */
export type SurveyInstrument = 'magnetic' | 'gyro'

/** 'gyro' when the method names a gyroscopic tool, else 'magnetic' (the cautious default). */
export function surveyInstrumentOf(method: string | null | undefined): SurveyInstrument {
  return /gyro|north[- ]?seeking/i.test(method ?? '') ? 'gyro' : 'magnetic'
}
