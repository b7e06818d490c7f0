import { execFileSync } from 'node:child_process'
import { existsSync, mkdtempSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { describe, expect, it } from 'vitest'
import { formatDistance } from '#shared/format/case-rows'
import { formatEstimate } from '#shared/utils/format'
import { GENESIS_HASH, checkChain, eventHash } from '../../../../../server/db/event-chain'
import { CONDENSER_WAKE } from '../../../../../server/db/seed-demo'
import { adviceRecord, overrideRecord } from '../../../../../server/utils/decisions/record'
import { decisionReportFilename, type DecisionReportData } from '../../../../../server/utils/report/data'
import { markdownToPlain } from '../../../../../server/utils/report/markdown-text'
import { renderDecisionReport } from '../../../../../server/utils/report/render'

// The PDF's numbers are the page's numbers (shared/utils/format.ts), written as typed with the
// embedded fonts: formatting conventions are ours, no source.
describe('markdownToPlain', () => {
  it('drops the markup (HTML tags too) and keeps the words, list items on their own lines', () => {
    const text = markdownToPlain('A **bold** claim with `code` and a [link](https://example.org).\n\n- first\n- second &amp; last\n\n<b>raw</b>')
    expect(text).toBe('A bold claim with code and a link.\n• first\n• second & last\nraw')
  })
})

/** A decision state built the way the server builds one: engine advice, an override, chained events. */
function overriddenCondenser(text: { title?: string; comment?: string; author?: string } = {}): DecisionReportData {
  const record = adviceRecord({ caseInput: CONDENSER_WAKE })
  const firstFired = record.advice.trace.find(t => t.fired)!.rule
  const { override } = overrideRecord(
    { caseInput: record.caseInput, advice: record.advice },
    { approach: 'wmles', model: 'WALE', wallTreatment: 'wall-model', comment: text.comment ?? 'Shear layers off the casing edges must stay resolved.', disagreedRules: [firstFired] },
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
  const names: Record<number, string> = { 1: text.author ?? 'Ada Ferreira', 3: 'Jonah Okafor' }
  return {
    decision: {
      id: 7, projectId: 3, title: text.title ?? 'Condenser wake and tonal noise', status: 'overridden', version: 3, revision: 1,
      caseInput: record.caseInput, advice: record.advice, notes: null,
      unitSystem: record.unitSystem, entered: record.entered, requested: null, changesRequestedBy: null,
      author: { id: 1, name: 'Ada Ferreira', email: 'engineer@eddyledger.test' },
      override, supersedesId: null, supersededById: null, createdAt: at(0), updatedAt: at(30),
    },
    project: { id: 3, code: 'KB-103', name: 'Rooftop condenser wake and noise' },
    events: events.map(({ actorId, ...e }) => ({ ...e, actor: { id: actorId, name: names[actorId]! } })),
    chain: { ...checkChain(events), problems: [] },
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
  }, 30_000) // three renders with embedded fonts: seconds each on a busy shared machine

  it.runIf(existsSync('/usr/bin/pdftotext'))('writes the engine figures in significant figures and scientific notation', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'eddy-report-'))
    const file = join(dir, 'report.pdf')
    writeFileSync(file, await renderDecisionReport(data, { generatedAt }))
    const text = execFileSync('/usr/bin/pdftotext', ['-layout', file, '-'], { encoding: 'utf8' })
    const first = data.decision.advice.approaches[0]!
    const squeeze = (t: string) => t.replace(/\s+/g, '')
    // The cost model's estimates to two figures, the near-wall mesh in the case's own units (mm in SI).
    expect(squeeze(text)).toContain(squeeze(formatEstimate(first.cells)))
    expect(squeeze(text)).toContain(squeeze(formatDistance(data.decision.override!.wall.firstCellHeight, 'si')))
    // The override's own cost beside the engine's.
    expect(squeeze(text)).toContain(squeeze(`Core-hours ${formatEstimate(data.decision.advice.approaches.find(a => a.id === data.decision.advice.recommendation.approach)!.coreHours)} ${formatEstimate(data.decision.override!.cost!.coreHours)}`))
    expect(text).toMatch(/page 1 of \d/)
    expect(text).toContain('Chain intact: 3 events')
  })

  it.runIf(existsSync('/usr/bin/pdftotext'))('prints names, titles and comments in any script as typed', async () => {
    const typed = {
      title: 'Ροή γύρω από κύλινδρο: Αθήνα, πτέρυγα Β',
      comment: 'Сдвиговые слои от кромок корпуса должны оставаться разрешёнными.',
      author: 'Zoë Łukasiewicz Núñez',
    }
    const dir = mkdtempSync(join(tmpdir(), 'eddy-report-'))
    const file = join(dir, 'report.pdf')
    writeFileSync(file, await renderDecisionReport(overriddenCondenser(typed), { generatedAt }))
    const text = execFileSync('/usr/bin/pdftotext', [file, '-'], { encoding: 'utf8' }).replace(/\s+/g, ' ')
    for (const words of Object.values(typed)) expect(text).toContain(words)
    expect(text).not.toContain('?')
  }, 30_000)

  it.runIf(existsSync('/usr/bin/pdftotext'))('says so in red when the ledger check finds the state forged, instead of "chain intact"', async () => {
    const forged = { ...data, chain: { ...data.chain, valid: false, problems: [{ kind: 'state' as const, decisionId: 7, detail: 'Its row disagrees with its history: its override differs from the one its history recorded' }] } }
    const dir = mkdtempSync(join(tmpdir(), 'eddy-report-'))
    const file = join(dir, 'report.pdf')
    writeFileSync(file, await renderDecisionReport(forged, { generatedAt }))
    const text = execFileSync('/usr/bin/pdftotext', ['-layout', file, '-'], { encoding: 'utf8' }).replace(/\s+/g, ' ')
    expect(text).not.toContain('Chain intact')
    expect(text).toContain('Ledger check failed (state): Its row disagrees with its history: its override differs from the one its history recorded')
  }, 30_000)
})
