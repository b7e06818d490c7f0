import { describe, expect, it } from 'vitest'
import { calibrate, calibratedEstimates, costPerCellStep, type RunFigures } from '#shared/verification/calibration'

// Cost per cell-step = core-hours x 3600 / (cells x steps): the definition the engine's own cost
// model uses (shared/rules/cost-model.ts); checks below are arithmetic on runs built with a known
// cost, so the source is the definition itself (common practice, no source).
function run(k: number, cells: number, timeSteps: number, extra: Partial<RunFigures> = {}): RunFigures {
  return { approach: 'wmles', hardware: 'cpu', cells, timeSteps, coreHours: (k * cells * timeSteps) / 3600, ...extra }
}

describe('calibration from run records', () => {
  it('gives back the cost per cell-step three runs were made with', () => {
    const [entry] = calibrate([run(4.2e-5, 2e7, 40_000), run(4.2e-5, 8e6, 25_000), run(4.2e-5, 3.1e7, 60_000)])
    expect(entry!.runs).toBe(3)
    expect(entry!.coreSecondsPerCellStep).toBeCloseTo(4.2e-5, 15)
    expect(entry!.spread).toBeCloseTo(1, 12)
    expect(entry!.adoptable).toBe(true)
  })

  it('takes the geometric mean and spread of differing runs', () => {
    const [entry] = calibrate([run(1e-5, 1e6, 1000), run(2e-5, 1e6, 1000), run(4e-5, 1e6, 1000)])
    // geometric mean of 1, 2, 4 (x1e-5) is 2; log spread sd = ln 2 (sample form) -> factor 2.
    expect(entry!.coreSecondsPerCellStep).toBeCloseTo(2e-5, 15)
    expect(entry!.spread).toBeCloseTo(2, 12)
    expect(entry!.min).toBeCloseTo(1e-5, 15)
    expect(entry!.max).toBeCloseTo(4e-5, 15)
  })

  it('keeps CPU and GPU apart and compares only CPU runs with the engine', () => {
    const estimated = { cells: 1e7, timeSteps: 20_000, coreHours: (2e-5 * 1e7 * 20_000) / 3600 }
    const entries = calibrate([
      run(6e-5, 2e7, 20_000, { estimated }),
      run(6e-5, 2e7, 20_000, { estimated }),
      run(1e-6, 2e7, 20_000, { hardware: 'gpu', estimated }),
    ])
    const cpu = entries.find(e => e.hardware === 'cpu')!
    const gpu = entries.find(e => e.hardware === 'gpu')!
    expect(cpu.runs).toBe(2)
    expect(cpu.adoptable).toBe(false)
    expect(cpu.costFactor).toBeCloseTo(3, 12)
    expect(cpu.cellsFactor).toBeCloseTo(2, 12)
    // actual / estimated core-hours = cells factor x cost factor here = 6
    expect(cpu.estimateFactor).toBeCloseTo(6, 12)
    expect(gpu.coreSecondsPerCellStep).toBeCloseTo(1e-6, 18)
    expect(gpu.estimateFactor).toBeNull()
  })

  it('recomputes an advice at the adopted cost per cell-step and says which it used', () => {
    const advice = {
      recommendation: { approach: 'wmles' as const },
      approaches: [
        { id: 'wmles' as const, cells: 1e7, timeSteps: 1e4, coreHours: (2e-5 * 1e11) / 3600 },
        { id: 'rans' as const, cells: 1e6, timeSteps: 3000, coreHours: (3e-5 * 3e9) / 3600 },
      ],
    }
    const none = calibratedEstimates(advice, null)
    expect(none.used).toBe('published')
    expect(none.coreHours).toBeCloseTo(advice.approaches[0]!.coreHours, 9)
    const adopted = { version: 2, adoptedAt: '2026-01-01T00:00:00Z', adoptedBy: 'Lead', entries: [{ approach: 'wmles' as const, hardware: 'cpu' as const, runs: 3, coreSecondsPerCellStep: 5e-5, spread: 1.2 }] }
    const block = calibratedEstimates(advice, adopted)
    expect(block.used).toBe('team')
    expect(block.runs).toBe(3)
    expect(block.factor).toBeCloseTo(2.5, 12)
    expect(block.coreHours).toBeCloseTo((5e-5 * 1e11) / 3600, 6)
    expect(block.approaches.find(a => a.approach === 'rans')!.used).toBe('published')
    expect(costPerCellStep({ cells: 1e7, timeSteps: 1e4, coreHours: block.coreHours })).toBeCloseTo(5e-5, 15)
  })
})
