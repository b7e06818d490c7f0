// The advice preview: the engine's answer for a case is a pure function of the case and the
// engine's and ruleset's versions, so identical cases (the questionnaire asks again as the
// engineer goes back and forth) are answered from memory, keyed by those versions. A published
// ruleset or a calibration read from the database joins the version key the same way.
import { advise, ENGINE_VERSION, RULESET, type Advice, type CaseInput, type Ruleset } from '#shared/rules'
import { canonicalHash } from '../../db/event-chain'
import { versionedCache } from '../cache/versioned'

// About 22 kB an advice: a few megabytes at most.
const cache = versionedCache<Advice>(256)

/**
 * The advice for a parsed case under a released ruleset (immutable once published, so its id and
 * version name its content); the same object for the same case, so it is never to be changed.
 */
export function adviceFor(caseInput: CaseInput, ruleset: Ruleset = RULESET): Advice {
  const version = `engine ${ENGINE_VERSION}, ruleset ${ruleset.id} ${ruleset.version}`
  return cache.get(version, canonicalHash(caseInput), () => advise(caseInput, { ruleset }))
}
