// The verification records as the API returns them (one description for the server's mappers and
// the pages). Timestamps are Date on the server and ISO strings after JSON.
import type { ApproachId } from '../rules/approaches'
import type { Hardware } from './calibration'
import type { GridStudyResult } from './grid-convergence'
import type { BadRow, WallCheckColumns } from './wall-check'
import type { Histogram, PatchStatistics, YPlusBand } from './wall-yplus'

type When = string | Date

export interface Retraction { reason: string; byId: number; at: When }

export interface WallCheckRecord {
  id: number
  decisionId: number
  fileName: string
  fileSha256: string
  sizeBytes: number
  compressed: boolean
  columns: WallCheckColumns
  rows: number
  badRows: number
  badRowSamples: BadRow[]
  band: YPlusBand
  areaWeighted: boolean
  totalArea: number | null
  fractionInBand: number
  fractionBelow: number
  fractionAbove: number
  minYPlus: number
  maxYPlus: number
  meanYPlus: number
  patches: PatchStatistics[]
  histogram: Histogram
  cautions: string[]
  passFraction: number
  verdict: 'pass' | 'fail'
  review: { accepted: boolean; comment: string; reviewerId: number; at: When } | null
  retraction: Retraction | null
  uploadedBy: number
  createdAt: When
}

export interface GridStudyRecord extends GridStudyResult {
  id: number
  quantity: string
  unit: string
  createdBy: number
  createdAt: When
  retraction: Retraction | null
}

export interface RunRecordView {
  id: number
  approach: ApproachId
  cells: number
  timeSteps: number
  innerIterations: number | null
  coreHours: number
  wallClockHours: number
  cores: number
  hardware: Hardware
  hardwareNote: string
  solverFamily: string
  estimated: { cells: number; timeSteps: number; coreHours: number } | null
  coreSecondsPerCellStep: number
  estimateFactor: number | null
  cautions: string[]
  createdBy: number
  createdAt: When
  retraction: Retraction | null
}

