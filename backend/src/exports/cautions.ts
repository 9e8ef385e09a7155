/** The cautions every pack carries (PDF cover, AGS4 PROJ_MEMO). */
export const CAUTIONS = [
  'Results are aids to professional judgement: they must be checked by a competent person, and local codes, standards and licensed practice govern design.',
  'Kinematic screening is not a stability analysis; set assignment is an interpretation.',
] as const
