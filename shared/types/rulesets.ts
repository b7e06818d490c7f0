// Shapes of the ruleset catalogue that the database, the server and the pages share. Type-only
// imports from the engine.
import type { ApproachId, WallTreatment } from '../rules'

/** What a canonical case must get: the approach, and the model and wall treatment when given. */
export interface ExpectedRecommendation {
  approach: ApproachId
  model?: string
  wallTreatment?: WallTreatment
}

/** The part of a recommendation the impact preview and the re-evaluation compare. */
export interface RecommendationChoice {
  approach: ApproachId
  model: string
  wallTreatment: WallTreatment
}

/** What a ruleset history event's payload may carry. */
export type RulesetEventPayload = Record<string, unknown>
