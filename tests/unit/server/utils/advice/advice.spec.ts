import { describe, expect, it } from 'vitest'
import { advise, caseInputSchema, RULESET } from '../../../../../shared/rules'
import { calibratedEstimates, type AdoptedCalibration } from '../../../../../shared/verification'
import { adviceAnswerJson, adviceFor } from '../../../../../server/utils/advice/advice'
import { DATA_HALL_DUCT } from '../../../../../server/db/seed-demo'

// The advice preview's answers kept by version (server/utils/advice/advice.ts). The advice itself is
// the engine's (its checks name their sources in tests/unit/shared/rules); here only that what is
// served from memory is what the engine and the calibration give, and that keys tell cases apart.
const parse = (draft: object) => caseInputSchema.parse(draft)
const reversed = (o: object) => Object.fromEntries(Object.entries(o).reverse())

const ADOPTED: AdoptedCalibration = {
  version: 3, adoptedAt: '2026-11-02T09:00:00.000Z', adoptedBy: 'A lead',
  entries: [{ approach: 'rans', hardware: 'cpu', coreSecondsPerCellStep: 2e-6, runs: 5, spread: 0.2 }],
}

describe('advice answers kept by version', () => {
  it('answers with the engine\'s advice and the calibrated estimates, as JSON', () => {
    const caseInput = parse(DATA_HALL_DUCT)
    const basis = { ruleset: RULESET, calibration: null }
    const answer = JSON.parse(adviceAnswerJson(caseInput, basis).toString('utf8'))
    const advice = advise(caseInput, { ruleset: RULESET })
    expect(answer).toEqual(JSON.parse(JSON.stringify({ advice, calibration: calibratedEstimates(advice, null) })))
  })

  it('takes a case sent with its keys in another order for the same case', () => {
    const basis = { ruleset: RULESET, calibration: null }
    const a = adviceAnswerJson(parse(DATA_HALL_DUCT), basis)
    const b = adviceAnswerJson(parse(reversed(DATA_HALL_DUCT)), basis)
    expect(b).toBe(a)
    expect(adviceFor(parse(reversed(DATA_HALL_DUCT)))).toBe(adviceFor(parse(DATA_HALL_DUCT)))
  })

  it('tells apart cases that differ, and the same case under another calibration', () => {
    const basis = { ruleset: RULESET, calibration: null }
    const slow = adviceAnswerJson(parse({ ...DATA_HALL_DUCT, velocity: 2 }), basis)
    const fast = adviceAnswerJson(parse({ ...DATA_HALL_DUCT, velocity: 9 }), basis)
    expect(fast).not.toBe(slow)
    expect(JSON.parse(fast.toString()).advice.reynolds).toBeGreaterThan(JSON.parse(slow.toString()).advice.reynolds)
    const calibrated = JSON.parse(adviceAnswerJson(parse(DATA_HALL_DUCT), { ruleset: RULESET, calibration: ADOPTED }).toString())
    expect(calibrated.calibration).toEqual(JSON.parse(JSON.stringify(calibratedEstimates(adviceFor(parse(DATA_HALL_DUCT)), ADOPTED))))
  })
})
