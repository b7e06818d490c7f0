/**
 * Estimated core-hours of every approach over a range of Reynolds numbers around the case, for the
 * log-log cost chart. The Reynolds number is varied through the velocity; everything else, and
 * each approach's wall treatment as advise() chose it for the case, stays fixed. At the case's own
 * Reynolds number the figures equal advise()'s.
 */
import { APPROACH_IDS, defaultWallTreatments, type ApproachId, type WallTreatment } from './approaches'
import { adviseParsed } from './advise'
import { parseCaseInput, type CaseInput, type CaseInputDraft } from './case-input'
import { costCaseFor } from './cost-case'
import { approachCost } from './cost-model'
import { flowPhysics } from './flow-physics'

export interface CostSweepOptions {
  /** decades either side of the case's Reynolds number (default 2) */
  decades?: number
  /** number of points, log-spaced (default 21; odd counts include the case itself) */
  points?: number
}

export interface CostSweep {
  reynolds: number[]
  /** core-hours per approach; the laminar series is included for every case, the advice lists it only for laminar and transitional flow */
  series: Record<ApproachId, number[]>
}

export function costSweep(input: CaseInput | CaseInputDraft, options: CostSweepOptions = {}): CostSweep {
  const decades = options.decades ?? 2
  const points = options.points ?? 21
  if (!(Number.isFinite(decades) && decades > 0 && decades <= 6)) {
    throw new RangeError('decades must be a number greater than 0 and at most 6.')
  }
  if (!(Number.isInteger(points) && points >= 2 && points <= 201)) {
    throw new RangeError('points must be a whole number from 2 to 201.')
  }
  const parsed = parseCaseInput(input)
  const advice = adviseParsed(parsed)
  const treatments: Record<ApproachId, WallTreatment> = { ...defaultWallTreatments() }
  for (const entry of advice.approaches) treatments[entry.id] = entry.wallTreatment

  const reynolds: number[] = []
  const series = Object.fromEntries(APPROACH_IDS.map((id) => [id, [] as number[]])) as Record<ApproachId, number[]>
  for (let index = 0; index < points; index++) {
    const exponent = decades * ((2 * index) / (points - 1) - 1)
    const velocity = exponent === 0 ? parsed.velocity : parsed.velocity * 10 ** exponent
    const physics = flowPhysics(parsed, velocity)
    const costCase = costCaseFor(parsed, physics)
    reynolds.push(physics.reynolds)
    for (const id of APPROACH_IDS) {
      series[id].push(approachCost(id, costCase, treatments[id], parsed.budget).coreHours)
    }
  }
  return { reynolds, series }
}
