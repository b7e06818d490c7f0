// What new advice stands on for a request: the published ruleset and the calibration in force. Their
// versions come from the request's own session query (server/utils/auth/session-version.ts); the
// compiled ruleset and the adopted calibration come from memory, keyed by those versions. So the
// advice preview makes no query beyond the one every signed-in request makes.
import type { H3Event } from 'h3'
import type { AdoptedCalibration } from '#shared/verification'
import type { Ruleset } from '#shared/rules'
import { versionsInForce } from '../auth/session'
import { publishedRuleset, releaseOf } from '../rulesets/rulesets'
import { adoptedCalibration } from '../verification/team-calibration'

export type AdviceBasis = { ruleset: Ruleset; calibration: AdoptedCalibration | null }

export async function adviceBasis(event: H3Event): Promise<AdviceBasis> {
  const inForce = await versionsInForce(event)
  // No published version yet: the catalogue is installed on the way (and a 503 when that fails).
  const ruleset = inForce.ruleset ? await releaseOf(inForce.ruleset) : await publishedRuleset()
  return { ruleset, calibration: await adoptedCalibration(inForce.calibration) }
}
