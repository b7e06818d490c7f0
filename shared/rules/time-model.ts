/**
 * Time steps and simulated time. The step comes from a CFL limit on each approach's finest
 * streamwise cell, with the acoustic factor 1 + 1/M for explicit compressible solvers. The
 * simulated time follows what is wanted: a start-up transient, then averaging flow-throughs for
 * statistics and mean values, or a number of shedding periods (from the Strouhal number) or of the
 * lowest frequency of interest for unsteady loads and noise.
 */
import type { ApproachId } from './approaches'
import type { CostCase, Separation } from './cost-case'
import { MACH_COMPRESSIBLE } from './regime'

/** Convective CFL of explicit DNS and LES (common practice, no source: explicit or semi-implicit schemes run near 0.5). */
export const RESOLVING_CFL = 0.5
/** CFL of hybrid RANS-LES and of unsteady laminar solutions with implicit time stepping in the resolved region (common practice, no source). */
export const IMPLICIT_RESOLVING_CFL = 1
/** CFL of URANS on its surface spacing: dual-time stepping tolerates larger steps, some 200 per shedding period (common practice, no source). */
export const URANS_CFL = 5
/** URANS and hybrid inner (dual-time) iterations per physical step, typically 5-20 (common practice, no source). */
export const URANS_INNER_ITERATIONS = 10
export const HYBRID_INNER_ITERATIONS = 5
/** Steady RANS iterations to converge forces, by separation (common practice, no source: 1e3-1e4). */
export const RANS_ITERATIONS: Readonly<Record<Separation, number>> = { none: 3000, mild: 5000, massive: 8000 }
/** Steady laminar solutions converge faster (our choice, no source). */
export const STEADY_LAMINAR_ITERATIONS = 2000

/**
 * Simulated time, in flow-throughs of the domain or in periods (common practice, no source):
 * a start-up transient of 3 flow-throughs or 10 periods; then mean values 10 flow-throughs or 20
 * periods; turbulence statistics 20 flow-throughs or 50 periods; unsteady loads and noise 50
 * flow-throughs or 100 shedding periods (spectra and peak values converge slowly), or 20 periods
 * of the lowest frequency of interest. URANS carries deterministic unsteadiness only and is run
 * for 20 periods after its transient.
 */
export const TRANSIENT = { flowThroughs: 3, periods: 10 } as const
export const AVERAGING = {
  mean: { flowThroughs: 10, periods: 20 },
  statistics: { flowThroughs: 20, periods: 50 },
  unsteady: { flowThroughs: 50, periods: 100 },
} as const
export const LOWEST_FREQUENCY_PERIODS = 20
export const URANS_PERIODS = 20

export interface TimePlan {
  /** physical time step, s (null for steady RANS) */
  timeStep: number | null
  /** simulated time, s (null for steady RANS) */
  simulatedTime: number | null
  flowThroughs: number | null
  /** shedding periods (or periods of the lowest frequency of interest) simulated, null when neither applies */
  periods: number | null
  /** physical steps, or iterations of a steady solution */
  steps: number
  /** inner iterations per physical step (1 for explicit schemes) */
  innerIterations: number
  cfl: number | null
  acousticFactor: number
}

/** 1 + 1/M for explicit compressible solvers of the resolving approaches, else 1. */
export function acousticFactor(approach: ApproachId, flow: CostCase): number {
  if (!(approach === 'dns' || approach === 'wrles' || approach === 'wmles')) return 1
  if (flow.mach === null || flow.timeIntegration === 'implicit') return 1
  if (flow.timeIntegration !== 'explicit' && flow.mach < MACH_COMPRESSIBLE) return 1
  return 1 + 1 / flow.mach
}

/** The period that sets the simulated time: the lowest frequency of interest, or the shedding period, s. */
function governingPeriod(flow: CostCase): number | null {
  if (flow.lowestFrequencyHz !== null && wantsUnsteady(flow)) return 1 / flow.lowestFrequencyHz
  return flow.strouhal === null ? null : flow.length / (flow.strouhal * flow.velocity)
}

function wantsUnsteady(flow: CostCase): boolean {
  return flow.quantities.includes('unsteady-loads') || flow.quantities.includes('noise')
}

/** A duration in flow-throughs, or in shedding periods when the body sheds, s. */
function span(need: { flowThroughs: number; periods: number }, flowThrough: number, shedding: number | null): number {
  return shedding === null ? need.flowThroughs * flowThrough : need.periods * shedding
}

/** Simulated time of a scale-resolving or hybrid run, s. */
export function resolvingTime(flow: CostCase): number {
  const flowThrough = flow.domain.length / flow.velocity
  const period = governingPeriod(flow)
  const shedding = flow.strouhal === null ? null : flow.length / (flow.strouhal * flow.velocity)
  const transient = span(TRANSIENT, flowThrough, shedding)
  let averaging = span(AVERAGING.mean, flowThrough, shedding)
  if (flow.quantities.includes('statistics')) averaging = Math.max(averaging, span(AVERAGING.statistics, flowThrough, shedding))
  if (wantsUnsteady(flow)) {
    averaging = Math.max(averaging, flow.lowestFrequencyHz !== null && period !== null ? LOWEST_FREQUENCY_PERIODS * period : span(AVERAGING.unsteady, flowThrough, shedding))
  }
  return transient + averaging
}

/** Simulated time of a URANS or unsteady laminar run: deterministic unsteadiness settles in fewer periods, s. */
export function periodicTime(flow: CostCase): number {
  const flowThrough = flow.domain.length / flow.velocity
  const period = governingPeriod(flow)
  if (period === null) return (TRANSIENT.flowThroughs + AVERAGING.mean.flowThroughs) * flowThrough
  return (TRANSIENT.periods + URANS_PERIODS) * period
}

/** Time plan of an unsteady run with a given simulated time, CFL and finest cell. */
export function unsteadyPlan(flow: CostCase, simulatedTime: number, cfl: number, finestCell: number, acoustic: number, inner: number): TimePlan {
  const timeStep = (cfl * finestCell) / (flow.velocity * acoustic)
  const period = governingPeriod(flow)
  return {
    timeStep,
    simulatedTime,
    flowThroughs: (simulatedTime * flow.velocity) / flow.domain.length,
    periods: period === null ? null : simulatedTime / period,
    steps: Math.max(1, Math.ceil(simulatedTime / timeStep - 1e-9)),
    innerIterations: inner,
    cfl,
    acousticFactor: acoustic,
  }
}

/** A steady solution: iterations only. */
export function steadyPlan(iterations: number): TimePlan {
  return { timeStep: null, simulatedTime: null, flowThroughs: null, periods: null, steps: iterations, innerIterations: 1, cfl: null, acousticFactor: 1 }
}
