// The editable survey row: what a logger types, plus the corrected values the server last returned.
import type { AzimuthReference, Id, Station, StationInput } from '../../api/types'

export const surveyFields = ['depth', 'azimuth', 'azimuthReference', 'plunge', 'method'] as const
export type SurveyField = (typeof surveyFields)[number]
export type SurveyValue = number | string | null

export interface SurveyRow {
  /** Stable key for rendering and edits; survives re-sorting. */
  key: string
  stationId: Id | null
  depth: number | null
  /** Azimuth as read, in the frame named by azimuthReference. */
  azimuth: number | null
  azimuthReference: AzimuthReference
  /** Degrees below horizontal, positive down. */
  plunge: number | null
  method: string
  /** True-north azimuth and declination the server applied; null until saved. */
  trueAzimuth: number | null
  declinationApplied: number | null
  /** Grid convergence the server applied (grid stations); shown only while trueAzimuth is known. */
  convergenceApplied?: number | null
}

export type RowErrors = Partial<Record<SurveyField, string>>

let nextKey = 0
export const newRowKey = () => `row-${++nextKey}`

export function rowFromStation(station: Station): SurveyRow {
  return {
    key: newRowKey(),
    stationId: station.id,
    depth: station.depth,
    azimuth: station.azimuthEntered,
    azimuthReference: station.azimuthReference,
    plunge: station.plunge,
    method: station.method,
    trueAzimuth: station.azimuth,
    declinationApplied: station.declinationApplied,
    convergenceApplied: station.convergenceApplied ?? null,
  }
}

/** Parses what was typed in a numeric cell: blank → null, comma accepted as decimal mark. */
export function parseCell(text: string): number | null {
  const trimmed = text.trim().replace(',', '.')
  if (trimmed === '') return null
  const value = Number(trimmed)
  return Number.isFinite(value) ? value : Number.NaN
}

/** Checks one row against the contract's ranges and the other rows' depths. */
export function rowErrors(row: SurveyRow, rows: readonly SurveyRow[]): RowErrors {
  const errors: RowErrors = {}
  if (row.depth === null || Number.isNaN(row.depth)) errors.depth = 'Depth is required'
  else if (row.depth < 0) errors.depth = 'Depth is measured from the collar: 0 or more'
  else if (rows.some((other) => other !== row && other.depth === row.depth)) {
    errors.depth = 'Another station has this depth'
  }
  if (row.azimuth === null || Number.isNaN(row.azimuth)) errors.azimuth = 'Azimuth is required'
  else if (row.azimuth < 0 || row.azimuth >= 360) errors.azimuth = 'Azimuth from 0 to below 360'
  if (row.plunge === null || Number.isNaN(row.plunge)) errors.plunge = 'Plunge is required'
  else if (row.plunge < -90 || row.plunge > 90) errors.plunge = 'Plunge from -90 to 90 (down +)'
  return errors
}

export function toStationInput(row: SurveyRow): StationInput {
  return {
    depth: row.depth as number,
    azimuth: row.azimuth as number,
    plunge: row.plunge as number,
    azimuthReference: row.azimuthReference,
    method: row.method.trim(),
  }
}
