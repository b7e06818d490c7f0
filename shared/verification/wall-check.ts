/**
 * What a stored wall y+ check holds beside its statistics: how the file was read and what was
 * wrong in it. Relative imports only.
 */
import type { WallStatistics } from './wall-yplus'

export interface WallCheckColumns {
  yPlus: string
  area: string | null
  patch: string | null
  /** false when the first row was data and the columns are numbered */
  header: boolean
  /** the delimiter found in the file: ",", "\t", ";" or "|" */
  delimiter: string
}

export interface BadRow {
  /** line number in the (decompressed) file, 1-based */
  line: number
  reason: string
}

export interface WallCheckResult extends WallStatistics {
  badRows: number
  /** the first bad rows, by line number */
  badRowSamples: BadRow[]
  cautions: string[]
}

/** How many bad rows are listed by line number; the rest are counted. */
export const BAD_ROW_SAMPLES = 50
/** A file with more bad rows than good ones is refused rather than judged (our rule). */
export const MAX_BAD_ROW_SHARE = 0.5
