/**
 * The invented Greyscar Quarry extension: a limestone-and-mudstone quarry deepening its north
 * wall (design face 70° toward 190°). Invented data, for the demo only.
 */
export const DEMO_PASSWORD = 'downdip-demo'

export const demoUsers = [
  { email: 'admin@greyscar.test', name: 'Ada Admin', isAdmin: true, role: null },
  { email: 'lead@greyscar.test', name: 'Lena Lead', isAdmin: false, role: 'lead' },
  { email: 'engineer@greyscar.test', name: 'Emeka Engineer', isAdmin: false, role: 'engineer' },
  { email: 'logger@greyscar.test', name: 'Lior Logger', isAdmin: false, role: 'logger' },
  { email: 'viewer@greyscar.test', name: 'Vera Viewer', isAdmin: false, role: 'viewer' },
] as const

export const demoProject = {
  code: 'GSQ',
  name: 'Greyscar Quarry north wall extension',
  crsEpsg: 32630,
  declinationMode: 'auto' as const,
  declinationDeg: -1.2,
  // Grid convergence from the CRS at each collar: +0.155° at GSQ-BH01 (grid north east of true
  // north, 12 km east of the zone's central meridian). The manual value is that, rounded.
  convergenceMode: 'auto' as const,
  gridConvergenceDeg: 0.16,
  referenceLine: 'bottom' as const,
  steepThresholdDeg: 85,
  netProjection: 'equal-area' as const,
}

export interface DemoHole {
  name: string
  collarEast: number
  collarNorth: number
  collarElevation: number
  plannedAzimuth: number
  plannedPlunge: number
  finalDepth: number
  startDate: string
  /** Survey tool's azimuth reference for this hole's stations. */
  surveyReference: 'magnetic' | 'true'
  /** Degrees per metre of azimuth drift and of plunge change (negative: the hole flattens). */
  azimuthDrift: number
  plungeDrift: number
}

export const demoHoles: DemoHole[] = [
  {
    name: 'GSQ-BH01',
    collarEast: 512410,
    collarNorth: 6012620,
    collarElevation: 212.4,
    plannedAzimuth: 10,
    plannedPlunge: 60,
    finalDepth: 150.0,
    startDate: '2026-03-02',
    surveyReference: 'magnetic',
    azimuthDrift: 0.04,
    plungeDrift: -0.03,
  },
  {
    name: 'GSQ-BH02',
    collarEast: 512585,
    collarNorth: 6012655,
    collarElevation: 214.9,
    plannedAzimuth: 355,
    plannedPlunge: 55,
    finalDepth: 250.0,
    startDate: '2026-03-16',
    surveyReference: 'magnetic',
    azimuthDrift: 0.03,
    plungeDrift: -0.02,
  },
  {
    name: 'GSQ-BH03',
    collarEast: 512760,
    collarNorth: 6012640,
    collarElevation: 213.1,
    plannedAzimuth: 20,
    plannedPlunge: 65,
    finalDepth: 180.0,
    startDate: '2026-04-01',
    surveyReference: 'true',
    azimuthDrift: 0.05,
    plungeDrift: -0.025,
  },
  {
    name: 'GSQ-BH04',
    collarEast: 512470,
    collarNorth: 6012480,
    collarElevation: 188.6,
    plannedAzimuth: 190,
    plannedPlunge: 50,
    finalDepth: 80.0,
    startDate: '2026-04-20',
    surveyReference: 'magnetic',
    azimuthDrift: -0.06,
    plungeDrift: -0.04,
  },
  {
    name: 'GSQ-BH05',
    collarEast: 512690,
    collarNorth: 6012470,
    collarElevation: 189.8,
    plannedAzimuth: 345,
    plannedPlunge: 70,
    finalDepth: 120.0,
    startDate: '2026-05-05',
    surveyReference: 'true',
    azimuthDrift: 0.02,
    plungeDrift: -0.01,
  },
  // steep hole: shows the near-vertical orientation warning
  {
    name: 'GSQ-BH06',
    collarEast: 512880,
    collarNorth: 6012560,
    collarElevation: 201.3,
    plannedAzimuth: 30,
    plannedPlunge: 86,
    finalDepth: 200.0,
    startDate: '2026-05-21',
    surveyReference: 'magnetic',
    azimuthDrift: 0.01,
    plungeDrift: 0.005,
  },
]
