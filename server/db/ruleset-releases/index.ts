// Versions of the engine's ruleset that shipped before the built-in one (shared/rules/ruleset.ts),
// oldest first. A fresh database holds them as retired versions, so every version a saved
// decision names can be read. Add the outgoing version here when the built-in version changes.
import { EDDYLEDGER_CORE_1_0_0 } from './eddyledger-core-1.0.0'
import type { ReleasedRulesetData } from './types'

export type { ReleasedRulesetData } from './types'

export const SHIPPED_RULESETS: readonly ReleasedRulesetData[] = [EDDYLEDGER_CORE_1_0_0]
