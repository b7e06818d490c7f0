// The advice preview: the engine's answer for a case is a pure function of the case and the
// engine's and ruleset's versions, so identical cases (the questionnaire asks again as the
// engineer goes back and forth) are answered from memory, keyed by those versions. A published
// ruleset or a calibration read from the database joins the version key the same way.
import { advise, ENGINE_VERSION, RULESET, type Advice, type CaseInput, type Ruleset } from '#shared/rules'
import { calibratedEstimates } from '#shared/verification'
import { versionedCache } from '../cache/versioned'
import type { AdviceBasis } from './basis'

// About 22 kB an advice: a few megabytes at most.
const cache = versionedCache<Advice>(256)
// The preview's whole answer as the bytes sent (about 45 kB of JSON): serialising and encoding it
// was most of what a repeated case cost, so the bytes are kept too.
const answers = versionedCache<Buffer>(128)

const versionOf = (ruleset: Ruleset) => `engine ${ENGINE_VERSION}, ruleset ${ruleset.id} ${ruleset.version}`

/**
 * A parsed case's key: its JSON, which is canonical because the schema's parse emits the schema's
 * keys in the schema's order (and drops unknown ones), whatever order the client sent them in.
 */
const caseKeyOf = (caseInput: CaseInput) => JSON.stringify(caseInput)

/**
 * The advice for a parsed case under a released ruleset (immutable once published, so its id and
 * version name its content); the same object for the same case, so it is never to be changed.
 */
export function adviceFor(caseInput: CaseInput, ruleset: Ruleset = RULESET, caseKey = caseKeyOf(caseInput)): Advice {
  return cache.get(versionOf(ruleset), caseKey, () => advise(caseInput, { ruleset }))
}

/** The preview's answer, `{ advice, calibration }`, as UTF-8 JSON: the engine's advice and the team-calibrated estimates. */
export function adviceAnswerJson(caseInput: CaseInput, { ruleset, calibration }: AdviceBasis): Buffer {
  const caseKey = caseKeyOf(caseInput)
  return answers.get(`${versionOf(ruleset)}, calibration ${calibration?.version ?? 'none'}`, caseKey, () => {
    const advice = adviceFor(caseInput, ruleset, caseKey)
    return Buffer.from(JSON.stringify({ advice, calibration: calibratedEstimates(advice, calibration) }))
  })
}
