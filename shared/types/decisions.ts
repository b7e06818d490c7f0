// Shapes of the decision record that the database, the server and the pages share. Type-only
// imports from the engine: nothing of it is bundled by importing these.
import type { ApproachId, WallFigures, WallTreatment } from '../rules'

/** A reviewer's choice in place of the engine's, with the near-wall figures recomputed for it. */
export interface DecisionOverride {
  approach: ApproachId
  model: string
  wallTreatment: WallTreatment
  yPlusTarget: number
  wall: WallFigures
  comment: string
  disagreedRules: string[]
  reviewer: { id: number; name: string }
}

/** What an event's payload may carry; each event type fills its own part. */
export type DecisionEventPayload = Record<string, unknown>
