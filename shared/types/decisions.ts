// Shapes of the decision record that the database, the server and the pages share (the schema
// types its jsonb columns with them). Type-only imports: nothing of the engine is bundled by these.
import type { ApproachCostFigures, ApproachId, WallFigures, WallTreatment } from '../rules'
import type { EnteredCase } from '../schemas/case-form'
import type { UnitSystem } from '../units'

/** The cost of one approach with one wall treatment, as the cost model counts it (costFor's figures). */
export type ChoiceCost = Pick<ApproachCostFigures, 'cells' | 'timeSteps' | 'coreHours' | 'wallClockHours' | 'memoryGB' | 'feasible' | 'layers'>

/** A choice other than the engine's, recomputed: its near-wall mesh and its cost. */
export interface ChoiceFigures {
  approach: ApproachId
  wallTreatment: WallTreatment
  wall: WallFigures
  cost: ChoiceCost
}

/** A reviewer's choice in place of the engine's, with the near-wall figures and the cost recomputed for it. */
export interface DecisionOverride {
  approach: ApproachId
  model: string
  wallTreatment: WallTreatment
  yPlusTarget: number
  /** the target y+ the reviewer typed, when they gave one (else yPlusTarget is the treatment's own) */
  requestedYPlus?: number
  wall: WallFigures
  /** the cost of the reviewer's approach with the reviewer's treatment (absent on overrides recorded before it was kept) */
  cost?: ChoiceCost
  comment: string
  disagreedRules: string[]
  reviewer: { id: number; name: string }
}

/** The engineer's own choice on a revision, against the engine's, with its reason and figures. */
export interface RequestedChoice {
  approach?: ApproachId
  wallTreatment?: WallTreatment
  reason: string
  /** the choice completed with the engine's approach or treatment where the engineer left one open, and costed */
  figures: ChoiceFigures
  /** set when the choice was taken over from a reviewer's override on the superseded decision */
  adoptedFrom?: { decisionId: number; reviewer: string }
}

/** How a revision was typed: the unit system and the values with their units. */
export interface EnteredRecord {
  unitSystem: UnitSystem
  entered: EnteredCase
}

/** What an event's payload may carry; each event type fills its own part. */
export type DecisionEventPayload = Record<string, unknown>
