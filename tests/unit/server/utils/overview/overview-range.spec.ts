// The overview reads whole months from its tallies and the days at either end from the decisions:
// the split must cover the range exactly, without overlap.
import { describe, expect, it } from 'vitest'
import { overviewRange } from '../../../../../server/utils/overview/overview'

const day = (iso: string) => new Date(`${iso}T00:00:00Z`)

describe('overviewRange', () => {
  it('reads everything from the tallies when no dates are given', () => {
    expect(overviewRange({})).toEqual({ months: { from: undefined, to: undefined }, days: [] })
  })

  it('splits a range into the whole months inside it and the days at either end', () => {
    expect(overviewRange({ from: '2025-01-15', to: '2025-04-10' })).toEqual({
      months: { from: day('2025-02-01'), to: day('2025-04-01') },
      days: [{ from: day('2025-01-15'), to: day('2025-02-01') }, { from: day('2025-04-01'), to: day('2025-04-11') }],
    })
  })

  it('takes a month that starts and ends the range whole', () => {
    expect(overviewRange({ from: '2025-02-01', to: '2025-02-28' })).toEqual({ months: { from: day('2025-02-01'), to: day('2025-03-01') }, days: [] })
    // 2024 is a leap year; the last day of December closes the year.
    expect(overviewRange({ from: '2024-02-01', to: '2024-12-31' })).toEqual({ months: { from: day('2024-02-01'), to: day('2025-01-01') }, days: [] })
  })

  it('reads a range within one month, or across a month end without a whole month, from the decisions', () => {
    expect(overviewRange({ from: '2025-03-03', to: '2025-03-09' })).toEqual({ months: null, days: [{ from: day('2025-03-03'), to: day('2025-03-10') }] })
    expect(overviewRange({ from: '2025-03-20', to: '2025-04-05' })).toEqual({ months: null, days: [{ from: day('2025-03-20'), to: day('2025-04-06') }] })
  })

  it('leaves an open end to the tallies', () => {
    expect(overviewRange({ from: '2025-03-20' })).toEqual({ months: { from: day('2025-04-01'), to: undefined }, days: [{ from: day('2025-03-20'), to: day('2025-04-01') }] })
    expect(overviewRange({ to: '2025-03-20' })).toEqual({ months: { from: undefined, to: day('2025-03-01') }, days: [{ from: day('2025-03-01'), to: day('2025-03-21') }] })
  })
})
