// Colours of sets on nets and in tables: Downdip's own, mid-tone so they read on the light and the
// dark panel alike, and distinct from the accent used for contours.
export const setPalette = [
  '#d0602c', // kiln orange
  '#2f79b5', // slate blue
  '#8e58b3', // heather
  '#3a965b', // moss
  '#c23f78', // berry
  '#a8851a', // ochre
  '#3f9ea4', // tarn
  '#7b6f5a', // flint
] as const

/** Poles outside every set. */
export const unassignedColour = '#8a93a0'

export function setColour(index: number): string {
  return index < 0 ? unassignedColour : setPalette[index % setPalette.length]
}
