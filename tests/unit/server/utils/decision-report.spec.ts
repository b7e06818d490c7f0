import { execFileSync } from 'node:child_process'
import { existsSync, mkdtempSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { describe, expect, it } from 'vitest'
import { formatQuantity, formatSci, formatSig } from '../../../../app/utils/format'
import { adviceRecord, overrideRecord } from '../../../../server/db/decision-record'
import { GENESIS_HASH, checkChain, eventHash } from '../../../../server/db/event-chain'
import { CONDENSER_WAKE } from '../../../../server/db/seed-demo'
import {
  decisionReportFilename, markdownToPlain, renderDecisionReport, reportText, type DecisionReportData,
} from '../../../../server/utils/decision-report'

// The PDF's numbers are the page's numbers (app/utils/format.ts), written in the glyphs the
// standard PDF fonts have (Windows-1252): formatting conventions are ours, no source.
describe('reportText', () => {
  it('writes a superscript power of ten as ^n, keeping the significant figures', () => {
    expect(reportText(formatSci(2.25e7))).toBe('2.25×10^7')
    expect(reportText(formatSci(3.4e-5))).toBe('3.4×10^-5')
    expect(reportText(formatSig(-1.234e-6))).toBe('-1.23×10^-6')
  })

  it('puts an ordinary space between a value and its unit and keeps Latin-1 symbols', () => {
    expect(reportText(formatQuantity(0.000123, 'm'))).toBe('1.23×10^-4 m')
    expect(reportText(formatQuantity(1.2, 'kg/m³'))).toBe('1.2 kg/m³')
    expect(reportText(formatQuantity(1.81e-5, 'Pa·s'))).toBe('1.81×10^-5 Pa·s')
  })

  it('spells out what the fonts cannot show', () => {
    expect(reportText('y+ ≈ 1, y+ ≤ 5, ∞')).toBe('y+ ~ 1, y+ <= 5, infinity')
    expect(reportText('k-ω SST')).toBe('k-omega SST')
    expect(reportText('Łódź')).toBe('?ódz')
    expect(reportText('café — “quoted”')).toBe('café — “quoted”')
  })
})

describe('markdownToPlain', () => {
  it('drops the markup (HTML tags too) and keeps the words, list items on their own lines', () => {
    const text = markdownToPlain('A **bold** claim with `code` and a [link](https://example.org).\n\n- first\n- second &amp; last\n\n<b>raw</b>')
    expect(text).toBe('A bold claim with code and a link.\n• first\n• second & last\nraw')
  })
})

/** A decision state built the way the server builds one: engine advice, an override, chained events. */
function overriddenCondenser(): DecisionReportData {
  const record = adviceRecord(CONDENSER_WAKE)
  const firstFired = record.advice.trace.find(t => t.fired)!.rule
  const { override } = overrideRecord(
    { caseInput: record.caseInput, advice: record.advice },
    { approach: 'wmles', model: 'WALE', wallTreatment: 'wall-model', comment: 'Shear layers off the casing edges must stay resolved.', disagreedRules: [firstFired] },
    { id: 3, name: 'Jonah Okafor' },
  )
  const at = (minutes: number) => new Date(Date.UTC(2026, 10, 2, 9, minutes))
  const raw = [
    { type: 'created' as const, actorId: 1, actorRole: 'engineer', payload: { revision: 1 }, createdAt: at(0) },
    { type: 'submitted' as const, actorId: 1, actorRole: 'engineer', payload: {}, createdAt: at(5) },
    { type: 'overridden' as const, actorId: 3, actorRole: 'reviewer', payload: { approach: 'wmles', comment: override.comment }, createdAt: at(30) },
  ]
  let prevHash = GENESIS_HASH
  const events = raw.map((e, index) => {
    const fields = { decisionId: 7, seq: index + 1, ...e }
    const hash = eventHash(prevHash, fields)
    const event = { ...fields, id: 100 + index, prevHash, hash }
    prevHash = hash
    return event
  })
  const names: Record<number, string> = { 1: 'Ada Ferreira', 3: 'Jonah Okafor' }
  return {
    decision: {
      id: 7, projectId: 3, title: 'Condenser wake and tonal noise', status: 'overridden', version: 3, revision: 1,
      caseInput: record.caseInput, advice: record.advice, notes: null,
      author: { id: 1, name: 'Ada Ferreira', email: 'engineer@eddyledger.test' },
      override, supersedesId: null, supersededById: null, createdAt: at(0), updatedAt: at(30),
    },
    project: { id: 3, code: 'KB-103', name: 'Rooftop condenser wake and noise' },
    events: events.map(({ actorId, ...e }) => ({ ...e, actor: { id: actorId, name: names[actorId]! } })),
    chain: checkChain(events),
    provenance: { rulesetId: record.rulesetId, rulesetVersion: record.rulesetVersion, engineVersion: record.engineVersion, inputHash: record.inputHash },
  } as DecisionReportData
}

describe('renderDecisionReport', () => {
  const data = overriddenCondenser()
  const generatedAt = new Date(Date.UTC(2026, 10, 3, 12, 0))

  it('names the file after the project, the decision and its version', () => {
    expect(decisionReportFilename(data)).toBe('eddyledger-KB-103-decision-7-v3.pdf')
  })

  it('gives the same bytes for the same decision state and generation time', async () => {
    const [a, b] = await Promise.all([renderDecisionReport(data, { generatedAt }), renderDecisionReport(data, { generatedAt })])
    expect(a.subarray(0, 5).toString('latin1')).toBe('%PDF-')
    expect(a.equals(b)).toBe(true)
    const later = await renderDecisionReport(data, { generatedAt: new Date(generatedAt.getTime() + 60_000) })
    expect(later.equals(a)).toBe(false)
  })

  it.runIf(existsSync('/usr/bin/pdftotext'))('writes the engine figures in significant figures and scientific notation', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'eddy-report-'))
    const file = join(dir, 'report.pdf')
    writeFileSync(file, await renderDecisionReport(data, { generatedAt }))
    const text = execFileSync('/usr/bin/pdftotext', ['-layout', file, '-'], { encoding: 'utf8' })
    const first = data.decision.advice.approaches[0]!
    expect(text).toContain(reportText(formatSci(first.cells)).replace('^', ''))
    expect(text).toContain(reportText(formatQuantity(data.decision.override!.wall.firstCellHeight, 'm')))
    expect(text).toMatch(/page 1 of \d/)
    expect(text).toContain('Chain intact: 3 events')
  })
})
