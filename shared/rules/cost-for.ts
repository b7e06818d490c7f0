/**
 * The cost of one approach for a chosen wall treatment and y+ target: what a reviewer's override
 * would need, with the same figures and ranges advise() gives for its own choices.
 */
import type { ApproachId, WallTreatment } from './approaches'
import { parseCaseInput, type CaseInput, type CaseInputDraft } from './case-input'
import { costCaseFor } from './cost-case'
import { approachCost, type ApproachCost } from './cost-model'
import { flowPhysics } from './flow-physics'

export type ApproachCostFigures = ApproachCost

/**
 * Cells, steps, core-hours, wall-clock, memory, time plan and ranges of `approach` with
 * `wallTreatment`, at `yPlusTarget` when given (modelled approaches), against the case's budget.
 */
export function costFor(
  input: CaseInput | CaseInputDraft,
  approach: ApproachId,
  wallTreatment: WallTreatment,
  yPlusTarget?: number,
): ApproachCostFigures {
  const parsed = parseCaseInput(input)
  return approachCost(approach, costCaseFor(parsed, flowPhysics(parsed)), wallTreatment, parsed.budget, yPlusTarget)
}
