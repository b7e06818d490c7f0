import { describe, expect, it } from 'vitest'
import { APPROACH_IDS, advise, costSweep, type CaseInputDraft } from '#shared/rules/index'

const input: CaseInputDraft = {
  regime: 'external',
  fluid: { medium: 'air' },
  velocity: 30,
  length: 2,
  geometry: 'bluff',
  separation: 'massive',
  quantities: ['unsteady-loads'],
  budget: { coreHours: 5e4, cores: 512, wallClockHours: 200 },
}

describe('costSweep', () => {
  it('spans Re/100 to 100 Re in 21 log-spaced points by default', () => {
    const sweep = costSweep(input)
    const { reynolds } = advise(input)
    expect(sweep.reynolds).toHaveLength(21)
    expect(sweep.reynolds[0]! / reynolds).toBeCloseTo(0.01, 9)
    expect(sweep.reynolds[20]! / reynolds).toBeCloseTo(100, 6)
    for (let index = 1; index < 21; index++) {
      expect(sweep.reynolds[index]! / sweep.reynolds[index - 1]!).toBeCloseTo(10 ** 0.2, 9)
    }
    for (const id of APPROACH_IDS) expect(sweep.series[id]).toHaveLength(21)
  })

  it("equals advise()'s core-hours at the case's own Re", () => {
    const sweep = costSweep(input, { decades: 3, points: 7 })
    const advice = advise(input)
    expect(sweep.reynolds[3]).toBe(advice.reynolds)
    for (const entry of advice.approaches) expect(sweep.series[entry.id][3]).toBe(entry.coreHours)
  })

  it('DNS core-hours rise faster with Re than wall-modelled LES, and WMLES faster than RANS (Choi & Moin 2012 scaling)', () => {
    const sweep = costSweep(input, { decades: 2, points: 5 })
    const growth = (id: (typeof APPROACH_IDS)[number]) => sweep.series[id][4]! / sweep.series[id][2]!
    expect(growth('dns')).toBeGreaterThan(growth('wmles'))
    expect(growth('wmles')).toBeGreaterThan(growth('rans'))
    for (let index = 1; index < 5; index++) expect(sweep.series.dns[index]!).toBeGreaterThan(sweep.series.dns[index - 1]!)
  })

  it('rejects nonsensical options', () => {
    expect(() => costSweep(input, { points: 1 })).toThrow(/points/)
    expect(() => costSweep(input, { decades: 0 })).toThrow(/decades/)
    expect(() => costSweep(input, { points: 2.5 })).toThrow(/points/)
  })
})
