/**
 * Discretisation uncertainty of a quantity computed on systematically refined grids: the procedure
 * of Celik, Ghia, Roache, Freitas, Coleman & Raad 2008 (ASME J. Fluids Eng. 130, 078001), with the
 * grid convergence index of Roache 1994 (ASME J. Fluids Eng. 116, 405). Errors and the GCI are
 * fractions. Relative imports only: runs on the server, in the browser and under plain Node.
 */

export interface GridLevel {
  cells: number
  value: number
}

/** Celik et al. 2008 advise refinement ratios r = h_coarse / h_fine of at least 1.3. */
export const MIN_REFINEMENT_RATIO = 1.3
/** Safety factor of the GCI for three-grid studies (Roache 1994; Celik et al. 2008, step 5). */
export const GCI_SAFETY_FACTOR = 1.25
const MAX_ITERATIONS = 200
const TOLERANCE = 1e-12

export type ConvergenceKind = 'monotonic' | 'oscillatory' | 'divergent' | 'unchanged'

export interface GridStudyResult {
  dimensions: 1 | 2 | 3
  /** the grids, finest first, with their representative size h = (1/N)^(1/D) (unit volume) */
  grids: (GridLevel & { h: number; used: boolean })[]
  /** r21 = h2/h1, r32 = h3/h2 of the three finest grids */
  r21: number
  r32: number
  /** e21 = phi2 - phi1, e32 = phi3 - phi2 */
  e21: number
  e32: number
  /** e21 / e32: between 0 and 1 monotonic convergence, below 0 oscillatory, above 1 divergent */
  convergenceRatio: number | null
  convergence: ConvergenceKind
  /** apparent order p; null when it cannot be defined */
  order: number | null
  iterations: number
  /** extrapolated value phi_ext^21 */
  extrapolated: number | null
  /** approximate relative error e_a^21 = |(phi1 - phi2) / phi1| */
  approximateError: number | null
  /** extrapolated relative error e_ext^21 = |(phi_ext - phi1) / phi_ext| */
  extrapolatedError: number | null
  /** fine-grid convergence index GCI_fine^21 = 1.25 e_a^21 / (r21^p - 1) */
  gciFine: number | null
  /** the same for the medium grid, GCI^32 = 1.25 e_a^32 / (r32^p - 1) */
  gciMedium: number | null
  warnings: string[]
}

/** Representative cell size of a grid of N cells in D dimensions, for a unit domain: h = (1/N)^(1/D). */
export function representativeSize(cells: number, dimensions: number): number {
  return (1 / cells) ** (1 / dimensions)
}

/**
 * Apparent order by fixed-point iteration (Celik et al. 2008, eqs. 5a-5c):
 * p = |ln|e32/e21| + q(p)| / ln r21, q(p) = ln((r21^p - s) / (r32^p - s)), s = sign(e32/e21).
 */
export function apparentOrder(r21: number, r32: number, e21: number, e32: number) {
  const s = Math.sign(e32 / e21)
  const logRatio = Math.log(Math.abs(e32 / e21))
  let p = Math.abs(logRatio) / Math.log(r21)
  for (let iteration = 1; iteration <= MAX_ITERATIONS; iteration++) {
    const q = Math.log((r21 ** p - s) / (r32 ** p - s))
    const next = Math.abs(logRatio + q) / Math.log(r21)
    if (!Number.isFinite(next)) return { order: null, iterations: iteration, converged: false }
    if (Math.abs(next - p) <= TOLERANCE * Math.max(1, next)) return { order: next, iterations: iteration, converged: true }
    p = next
  }
  return { order: p, iterations: MAX_ITERATIONS, converged: false }
}

function fmt(value: number) {
  return Number(value.toPrecision(3)).toString()
}

/**
 * The study of three or more grids: with more than three, the three finest are used and the others
 * are listed. Throws on fewer than three grids or on grids that share a cell count.
 */
export function gridConvergence(levels: readonly GridLevel[], dimensions: 1 | 2 | 3): GridStudyResult {
  if (levels.length < 3) throw new Error('A grid-convergence study needs at least three grids.')
  const sorted = [...levels].sort((a, b) => b.cells - a.cells)
  for (let i = 1; i < sorted.length; i++) {
    if (sorted[i]!.cells === sorted[i - 1]!.cells) throw new Error(`Two grids have the same number of cells (${sorted[i]!.cells}); each grid must be a different refinement.`)
  }
  const grids = sorted.map((g, i) => ({ ...g, h: representativeSize(g.cells, dimensions), used: i < 3 }))
  const [g1, g2, g3] = grids as [typeof grids[0], typeof grids[0], typeof grids[0]]
  const r21 = g2.h / g1.h
  const r32 = g3.h / g2.h
  const e21 = g2.value - g1.value
  const e32 = g3.value - g2.value
  const warnings: string[] = []
  if (r21 < MIN_REFINEMENT_RATIO) warnings.push(`The refinement ratio r21 = ${fmt(r21)} is below ${MIN_REFINEMENT_RATIO}; Celik et al. (2008) advise at least ${MIN_REFINEMENT_RATIO} so that the discretisation error stands out from other errors.`)
  if (r32 < MIN_REFINEMENT_RATIO) warnings.push(`The refinement ratio r32 = ${fmt(r32)} is below ${MIN_REFINEMENT_RATIO}; Celik et al. (2008) advise at least ${MIN_REFINEMENT_RATIO} so that the discretisation error stands out from other errors.`)
  if (grids.length > 3) warnings.push(`${grids.length} grids were given; the three finest are used and the ${grids.length - 3} coarser ones are shown for reference.`)

  const empty = {
    dimensions, grids, r21, r32, e21, e32, order: null, iterations: 0, extrapolated: null,
    approximateError: null, extrapolatedError: null, gciFine: null, gciMedium: null, warnings,
  }
  if (e21 === 0 && e32 === 0) {
    warnings.push('The quantity is the same on all three grids: no order or error can be estimated from them (it may be insensitive to the grid, or the values were rounded too far).')
    return { ...empty, convergenceRatio: null, convergence: 'unchanged' }
  }
  if (e21 === 0 || e32 === 0) {
    warnings.push('Two consecutive grids give the same value: the apparent order is undefined. Check the values, or refine further.')
    return { ...empty, convergenceRatio: e32 === 0 ? null : e21 / e32, convergence: e32 === 0 ? 'divergent' : 'monotonic' }
  }
  const convergenceRatio = e21 / e32
  const convergence: ConvergenceKind = convergenceRatio < 0 ? 'oscillatory' : convergenceRatio >= 1 ? 'divergent' : 'monotonic'
  if (convergence === 'oscillatory') warnings.push('Oscillatory convergence: the change between grids alternates in sign (e21/e32 < 0). The estimates below are less reliable; Celik et al. (2008) report such cases separately.')
  if (convergence === 'divergent') warnings.push('Divergent: the change from the medium to the fine grid is not smaller than from the coarse to the medium (e21/e32 ≥ 1). The solution is not in the asymptotic range; refine further before quoting an uncertainty.')

  const { order, iterations, converged } = apparentOrder(r21, r32, e21, e32)
  if (order === null || !converged) {
    warnings.push('The fixed-point iteration for the apparent order did not converge; no extrapolation is given.')
    return { ...empty, convergenceRatio, convergence, iterations }
  }
  const r21p = r21 ** order
  const r32p = r32 ** order
  const extrapolated = (r21p * g1.value - g2.value) / (r21p - 1)
  const approximateError = Math.abs((g1.value - g2.value) / g1.value)
  const extrapolatedError = Math.abs((extrapolated - g1.value) / extrapolated)
  const gciFine = (GCI_SAFETY_FACTOR * approximateError) / (r21p - 1)
  const gciMedium = (GCI_SAFETY_FACTOR * Math.abs((g2.value - g3.value) / g2.value)) / (r32p - 1)
  return {
    dimensions, grids, r21, r32, e21, e32, convergenceRatio, convergence, order, iterations,
    extrapolated, approximateError, extrapolatedError, gciFine, gciMedium, warnings,
  }
}
