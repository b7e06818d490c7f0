/**
 * The wall y+ check: the band a signed-off wall treatment asks for, and statistics of a solver's
 * wall export against it (area-weighted when face areas are given), per patch and as a histogram on
 * a logarithmic axis. Built to accumulate row by row, so a large export is never held in memory.
 * Relative imports only: the server, the browser and plain Node use it.
 */
import type { ApproachId, WallTreatment } from '../rules/approaches'
import {
  BLENDED_Y_PLUS_BAND, RESOLVED_Y_PLUS, WALL_FUNCTION_Y_PLUS_BAND, laminarYPlusTarget, yPlusTargetFor,
} from '../rules/near-wall'

export type BandBasis = WallTreatment | 'target'

export interface YPlusBand {
  min: number
  max: number
  basis: BandBasis
  /** what the band is, in words, with its source */
  label: string
}

/** A target is met within a factor of two either way (common practice, no source). */
export const OWN_TARGET_FACTOR = 2
/** A team's default share of wall area inside the band for a check to pass (common practice, no source). */
export const DEFAULT_PASS_FRACTION = 0.9

export interface SignedOffWall {
  approach: ApproachId
  wallTreatment: WallTreatment
  yPlusTarget: number
  deltaPlus: number
  /** k_s+ of a rough wall, null or 0 when smooth */
  roughnessPlus?: number | null
}

/** The first-cell y+ the engine itself aims at for this approach and treatment. */
function engineTarget(signed: SignedOffWall) {
  if (signed.approach === 'laminar') return laminarYPlusTarget(signed.deltaPlus)
  return yPlusTargetFor(signed.wallTreatment, signed.deltaPlus, signed.approach, signed.roughnessPlus ?? 0)
}

function aroundTarget(t: number, basis: BandBasis, label: string): YPlusBand {
  return { min: t / OWN_TARGET_FACTOR, max: t * OWN_TARGET_FACTOR, basis, label }
}

/**
 * The band of first-cell y+ that the signed-off treatment asks for. A target that differs from the
 * engine's own (an engineer's input or a reviewer's override) gives a band about that target.
 */
export function bandFor(signed: SignedOffWall): YPlusBand {
  const t = signed.yPlusTarget
  const own = engineTarget(signed)
  if (Math.abs(t - own) > 1e-9 * Math.max(1, own)) {
    if (signed.wallTreatment === 'resolved') {
      return { min: 0, max: t, basis: 'target', label: `Signed-off target: first-cell y+ at or below ${fmt(t)} on a resolved wall` }
    }
    return aroundTarget(t, 'target', `Signed-off target y+ = ${fmt(t)}, within a factor of ${OWN_TARGET_FACTOR} either way (common practice, no source)`)
  }
  switch (signed.wallTreatment) {
    case 'resolved':
      return { min: 0, max: RESOLVED_Y_PLUS, basis: 'resolved', label: `Resolved viscous sublayer: first-cell y+ at or below ${RESOLVED_Y_PLUS} (common practice; Georgiadis et al. 2010 for LES and DNS)` }
    case 'wall-function':
      return {
        min: WALL_FUNCTION_Y_PLUS_BAND.min, max: WALL_FUNCTION_Y_PLUS_BAND.max, basis: 'wall-function',
        label: `Log-law wall functions (Launder & Spalding 1974): first-cell y+ from ${WALL_FUNCTION_Y_PLUS_BAND.min} to ${WALL_FUNCTION_Y_PLUS_BAND.max} (common practice)`,
      }
    case 'rough-wall-function': {
      const min = Math.max(WALL_FUNCTION_Y_PLUS_BAND.min, signed.roughnessPlus ?? 0)
      const max = Math.max(WALL_FUNCTION_Y_PLUS_BAND.max, OWN_TARGET_FACTOR * min)
      return {
        min, max, basis: 'rough-wall-function',
        label: `Rough-wall log-law functions: first-cell y+ from ${fmt(min)} (above the roughness, y+ ≥ k_s+; Blocken et al. 2007) to ${fmt(max)}`,
      }
    }
    case 'blended':
      return {
        min: BLENDED_Y_PLUS_BAND.min, max: BLENDED_Y_PLUS_BAND.max, basis: 'blended',
        label: `Blended wall treatment (Popovac & Hanjalić 2007): first-cell y+ from ${BLENDED_Y_PLUS_BAND.min} to ${BLENDED_Y_PLUS_BAND.max} (the engine's band; our choice)`,
      }
    case 'wall-model':
      return aroundTarget(t, 'wall-model', `Wall-modelled LES: cells of about δ/20 at the wall (Larsson et al. 2016), first-cell y+ ≈ ${fmt(t)}, within a factor of ${OWN_TARGET_FACTOR} either way (common practice, no source)`)
  }
}

function fmt(value: number) {
  return Number(value.toPrecision(3)).toString()
}

// ---- columns

export interface ColumnMapping {
  yPlus: string
  area?: string
  patch?: string
}

const Y_PLUS = /^\s*y[\s_\-.]*(\+|plus|p)\s*(\(.*\))?\s*$|wall[\s_\-.]*y[\s_\-.]*(\+|plus)|yplus|y_plus|y\+/i
const AREA = /^\s*(face[\s_\-.]*)?area\b|\barea\s*(\[.*\]|\(.*\))?\s*$|^\s*(mag[\s_\-.]*)?sf\s*$|^\s*a\s*(\[m\^?2\]|\(m\^?2\))?\s*$/i
const PATCH = /patch|boundary|zone|surface|region|wall[\s_\-.]*name|^\s*name\s*$/i

/**
 * Guesses which columns hold y+, face area and patch from a header. `ambiguous` lists what the
 * person must choose: no y+ column or more than one candidate for a role.
 */
export function guessColumns(header: readonly string[]): { mapping: Partial<ColumnMapping>; ambiguous: ('yPlus' | 'area' | 'patch')[] } {
  const yPlus = header.filter(name => Y_PLUS.test(name))
  const area = header.filter(name => AREA.test(name) && !Y_PLUS.test(name))
  const patch = header.filter(name => PATCH.test(name) && !Y_PLUS.test(name) && !AREA.test(name))
  const mapping: Partial<ColumnMapping> = {}
  const ambiguous: ('yPlus' | 'area' | 'patch')[] = []
  if (yPlus.length === 1) mapping.yPlus = yPlus[0]
  else if (header.length === 1) mapping.yPlus = header[0]
  else ambiguous.push('yPlus')
  if (area.length === 1) mapping.area = area[0]
  else if (area.length > 1) ambiguous.push('area')
  if (patch.length === 1) mapping.patch = patch[0]
  else if (patch.length > 1) ambiguous.push('patch')
  return { mapping, ambiguous }
}

/** Names of the columns of a file without a header row: "column 1", "column 2", ... */
export function numberedColumns(count: number): string[] {
  return Array.from({ length: count }, (_, i) => `column ${i + 1}`)
}

/** True when a first row looks like data (every cell a number), so the file has no header row. */
export function looksLikeData(row: readonly string[]): boolean {
  const cells = row.filter(cell => cell.trim() !== '')
  return cells.length > 0 && cells.every(cell => Number.isFinite(Number(cell.trim())))
}

// ---- statistics

/** Histogram bins per decade of y+ (our choice: fine enough to see the band's edges). */
export const BINS_PER_DECADE = 10
/** The histogram spans decades from 10^-3 to 10^4 at most; values outside fall in the end bins. */
const LOWEST_DECADE = -3
const HIGHEST_DECADE = 4

interface Tally {
  faces: number
  weight: number
  below: number
  inside: number
  above: number
  min: number
  max: number
  /** sum of weight x y+ for the (area-weighted) mean */
  weighted: number
}

function newTally(): Tally {
  return { faces: 0, weight: 0, below: 0, inside: 0, above: 0, min: Infinity, max: -Infinity, weighted: 0 }
}

export interface PatchStatistics {
  patch: string
  faces: number
  /** total face area of the patch (m² as exported), or null when no areas were given */
  area: number | null
  minYPlus: number
  maxYPlus: number
  /** area-weighted (or plain) mean y+ */
  meanYPlus: number
  fractionInBand: number
  fractionBelow: number
  fractionAbove: number
}

export interface Histogram {
  /** bin edges in y+ (length bins + 1), evenly spaced in log10 */
  edges: number[]
  /** share of the wall (area or faces) per bin; sums to 1 */
  fractions: number[]
  counts: number[]
}

export interface WallStatistics {
  rows: number
  areaWeighted: boolean
  band: { min: number; max: number }
  fractionInBand: number
  fractionBelow: number
  fractionAbove: number
  minYPlus: number
  maxYPlus: number
  meanYPlus: number
  totalArea: number | null
  patches: PatchStatistics[]
  histogram: Histogram
}

/**
 * Accumulates faces one at a time. Give every face an area or none: a file either has an area
 * column (area-weighted) or not (each face counts once).
 */
export class WallTally {
  private readonly total = newTally()
  private readonly byPatch = new Map<string, Tally>()
  // Bins over the widest span; trimmed to the occupied decades at the end.
  private readonly bins = new Float64Array((HIGHEST_DECADE - LOWEST_DECADE) * BINS_PER_DECADE)
  private readonly binCounts = new Float64Array((HIGHEST_DECADE - LOWEST_DECADE) * BINS_PER_DECADE)

  constructor(readonly band: { min: number; max: number }, readonly areaWeighted: boolean) {}

  add(yPlus: number, area = 1, patch = '') {
    const w = this.areaWeighted ? area : 1
    for (const t of [this.total, this.patchTally(patch)]) {
      t.faces++
      t.weight += w
      t.weighted += w * yPlus
      if (yPlus < t.min) t.min = yPlus
      if (yPlus > t.max) t.max = yPlus
      if (yPlus < this.band.min) t.below += w
      else if (yPlus > this.band.max) t.above += w
      else t.inside += w
    }
    const bin = binIndex(yPlus, this.bins.length)
    this.bins[bin]! += w
    this.binCounts[bin]! += 1
  }

  get rows() {
    return this.total.faces
  }

  private patchTally(patch: string) {
    let t = this.byPatch.get(patch)
    if (!t) {
      t = newTally()
      this.byPatch.set(patch, t)
    }
    return t
  }

  result(): WallStatistics {
    const t = this.total
    const share = (part: number, whole: number) => (whole > 0 ? part / whole : 0)
    const patches = [...this.byPatch.entries()]
      .map(([patch, p]) => ({
        patch,
        faces: p.faces,
        area: this.areaWeighted ? p.weight : null,
        minYPlus: p.min,
        maxYPlus: p.max,
        meanYPlus: share(p.weighted, p.weight),
        fractionInBand: share(p.inside, p.weight),
        fractionBelow: share(p.below, p.weight),
        fractionAbove: share(p.above, p.weight),
      }))
      .sort((a, b) => a.patch.localeCompare(b.patch))
    return {
      rows: t.faces,
      areaWeighted: this.areaWeighted,
      band: { min: this.band.min, max: this.band.max },
      fractionInBand: share(t.inside, t.weight),
      fractionBelow: share(t.below, t.weight),
      fractionAbove: share(t.above, t.weight),
      minYPlus: t.faces ? t.min : 0,
      maxYPlus: t.faces ? t.max : 0,
      meanYPlus: share(t.weighted, t.weight),
      totalArea: this.areaWeighted ? t.weight : null,
      patches,
      histogram: this.histogram(t.weight),
    }
  }

  private histogram(totalWeight: number): Histogram {
    let first = this.bins.length
    let last = -1
    for (let i = 0; i < this.bins.length; i++) {
      if (this.binCounts[i]! > 0) {
        first = Math.min(first, i)
        last = i
      }
    }
    if (last < 0) return { edges: [], fractions: [], counts: [] }
    // Whole decades, so the axis starts and ends on a power of ten.
    const from = Math.floor(first / BINS_PER_DECADE) * BINS_PER_DECADE
    const to = Math.ceil((last + 1) / BINS_PER_DECADE) * BINS_PER_DECADE
    const edges: number[] = []
    for (let i = from; i <= to; i++) edges.push(10 ** (LOWEST_DECADE + i / BINS_PER_DECADE))
    const fractions: number[] = []
    const counts: number[] = []
    for (let i = from; i < to; i++) {
      fractions.push(totalWeight > 0 ? this.bins[i]! / totalWeight : 0)
      counts.push(this.binCounts[i]!)
    }
    return { edges, fractions, counts }
  }
}

function binIndex(yPlus: number, bins: number) {
  if (!(yPlus > 0)) return 0
  const index = Math.floor((Math.log10(yPlus) - LOWEST_DECADE) * BINS_PER_DECADE + 1e-9)
  return Math.min(bins - 1, Math.max(0, index))
}

/** Reads one y+ value: a finite number, zero or more. */
export function parseYPlus(text: string | undefined): number | string {
  const raw = (text ?? '').trim()
  if (raw === '') return 'no y+ value'
  const value = Number(raw)
  if (!Number.isFinite(value)) return `y+ "${raw.slice(0, 40)}" is not a number`
  if (value < 0) return `y+ ${raw} is negative`
  return value
}

/** Reads one face area: a finite number above zero. */
export function parseArea(text: string | undefined): number | string {
  const raw = (text ?? '').trim()
  if (raw === '') return 'no face area'
  const value = Number(raw)
  if (!Number.isFinite(value)) return `area "${raw.slice(0, 40)}" is not a number`
  if (value <= 0) return `area ${raw} is not positive`
  return value
}

export function verdictFor(fractionInBand: number, passFraction: number): 'pass' | 'fail' {
  return fractionInBand >= passFraction ? 'pass' : 'fail'
}
