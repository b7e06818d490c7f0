// The PDF record of a decision, for QA to file: what was asked, what the engine advised, what the
// reviewer decided, and the verified history, laid out in our own design with embedded fonts.
import PDFDocument from 'pdfkit'
import { GENERAL_CAUTIONS } from '#shared/rules/cautions'
import { DECISION_STATUS_LABELS } from '#shared/utils/decision-status'
import { ROLE_LABELS, type Role } from '#shared/utils/roles'
import { formatDuration, formatEstimate, formatQuantity, formatSig } from '#shared/utils/format'
import type { DecisionReportData } from './data'
import { registerReportFonts, REPORT_FONTS } from './fonts'
import { ACCENT, INK, MARGIN, MUTED, RULE, ReportWriter } from './layout'
import { markdownToPlain } from './markdown-text'
import { FOOTER_CAUTION, approachLabel, caseRows, costComparisonRows, eventDetails, treatmentLabel, utc, wallRows } from './sections'
import { writeVerification } from './verification'

/**
 * The PDF bytes. The same decision state gives the same bytes, except the "generated at" line
 * (pass `generatedAt` to fix it): the document's creation date is the decision's last change.
 */
export function renderDecisionReport(data: DecisionReportData, options: { generatedAt?: Date } = {}): Promise<Buffer> {
  const { decision, project, events, chain, provenance } = data
  const { advice, override } = decision
  const generatedAt = options.generatedAt ?? new Date()
  const updatedAt = new Date(decision.updatedAt)
  const doc = new PDFDocument({
    size: 'A4',
    margins: MARGIN,
    bufferPages: true,
    info: {
      Title: `${project.code} decision ${decision.id} v${decision.version}: ${decision.title}`,
      Author: decision.author.name,
      Subject: 'Eddyledger decision record',
      Creator: 'Eddyledger',
      Producer: 'Eddyledger',
      CreationDate: updatedAt,
      ModDate: updatedAt,
    },
  })
  const chunks: Buffer[] = []
  doc.on('data', (chunk: Buffer) => chunks.push(chunk))
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)))
    doc.on('error', reject)
  })
  registerReportFonts(doc)
  const w = new ReportWriter(doc)

  // Header
  doc.font(REPORT_FONTS.bold).fontSize(9).fillColor(ACCENT).text('EDDYLEDGER · DECISION RECORD', MARGIN.left, MARGIN.top, { characterSpacing: 0.6 })
  doc.font(REPORT_FONTS.sans).fontSize(9).fillColor(MUTED).text(`Project ${project.code} · ${project.name}`)
  doc.moveDown(0.3)
  doc.font(REPORT_FONTS.bold).fontSize(16).fillColor(INK).text(decision.title, { width: w.width })
  doc.moveDown(0.4)
  w.fields([
    ['Decision', `${decision.id}`],
    ['Status', DECISION_STATUS_LABELS[decision.status]],
    ['Version', `${decision.version}`],
    ['Revision', `${decision.revision}`],
    ['Author', decision.author.name],
    ['Project', `${project.code}`],
    ['Created', utc(decision.createdAt)],
    ['Updated', utc(decision.updatedAt)],
    ...(decision.supersedesId ? [['Supersedes', `decision ${decision.supersedesId}`] as [string, string]] : []),
    ...(decision.supersededById ? [['Superseded by', `decision ${decision.supersededById}`] as [string, string]] : []),
  ], 2)
  doc.moveDown(0.6)
  const cautions = [...GENERAL_CAUTIONS, ...advice.cautions.filter((c) => !GENERAL_CAUTIONS.includes(c))]
  w.cautions(cautions)

  // Recommendation and the reviewer's decision
  w.heading(override ? "Recommendation and the reviewer's override" : 'Recommendation')
  const engine = advice.recommendation
  w.table(
    override
      ? [{ header: '', width: 1 }, { header: "Engine's recommendation", width: 2 }, { header: "Reviewer's choice (stands)", width: 2 }]
      : [{ header: '', width: 1 }, { header: "Engine's recommendation", width: 4 }],
    [
      ['Approach', approachLabel(engine.approach), ...(override ? [approachLabel(override.approach)] : [])],
      ['Model', engine.model, ...(override ? [override.model] : [])],
      ['Wall treatment', treatmentLabel(engine.wallTreatment), ...(override ? [treatmentLabel(override.wallTreatment)] : [])],
      ['Target y+', formatSig(engine.yPlusTarget), ...(override ? [formatSig(override.yPlusTarget)] : [])],
      // Each column costed for its own approach and treatment.
      ...(override ? costComparisonRows(advice, override.cost) : []),
    ],
  )
  if (override) {
    w.paragraph(`Overridden by ${override.reviewer.name}. Reviewer's reason:`, { font: REPORT_FONTS.bold })
    w.paragraph(override.comment, { indent: 10 })
    doc.moveDown(0.3)
    const titles = new Map(advice.trace.map((t) => [t.rule, t.title]))
    w.paragraph('Rules the reviewer disagreed with:', { font: REPORT_FONTS.bold })
    w.paragraph(override.disagreedRules.length
      ? override.disagreedRules.map((id) => `• ${id}${titles.has(id) ? `: ${titles.get(id)}` : ''}`).join('\n')
      : 'none named', { indent: 10 })
  } else if (decision.status === 'approved') {
    const approval = [...events].reverse().find((e) => e.type === 'approved')
    if (approval) w.paragraph(`Approved by ${approval.actor.name} on ${utc(approval.createdAt)}.`)
  }

  // The engineer's own choice, against the engine's
  const requested = decision.requested
  if (requested) {
    w.heading("The engineer's own choice")
    w.table(
      [{ header: '', width: 1 }, { header: "Engine's recommendation", width: 2 }, { header: "Engineer's choice", width: 2 }],
      [
        ['Approach', approachLabel(engine.approach), approachLabel(requested.figures.approach)],
        ['Wall treatment', treatmentLabel(engine.wallTreatment), treatmentLabel(requested.figures.wallTreatment)],
        ...costComparisonRows(advice, requested.figures.cost),
      ],
    )
    w.paragraph(`Reason: ${requested.reason}`, { indent: 10 })
  }

  // Case input, as typed and in its units
  w.heading(`Case input as typed (${decision.unitSystem === 'imperial' ? 'imperial' : 'SI'} units)`)
  w.fields(caseRows(data))

  // Near-wall mesh
  w.heading(override ? "Near-wall mesh for the reviewer's choice (recomputed)" : 'Near-wall mesh')
  w.paragraph('Cell-centred mesh: the first-cell height is twice the distance of its centre from the wall. Flat-plate or pipe correlations; check y+ on the real solution.', { size: 8, color: MUTED })
  doc.moveDown(0.3)
  w.fields(wallRows(override?.wall ?? advice.wall, decision.unitSystem))

  // Approaches
  w.heading('Approaches weighed')
  const chosenId = override?.approach ?? engine.approach
  w.table(
    [
      { header: 'Approach', width: 2.6 }, { header: 'Score', width: 0.8, align: 'right' }, { header: 'Cells', width: 1.1, align: 'right' },
      { header: 'Steps', width: 1.1, align: 'right' }, { header: 'Core-hours', width: 1.2, align: 'right' },
      { header: 'Wall-clock', width: 1.1, align: 'right' }, { header: 'Memory', width: 1.1, align: 'right' },
      { header: 'Fits budget', width: 0.9 },
    ],
    advice.approaches.map((a) => [
      `${a.label}${a.id === engine.approach ? ' (recommended)' : ''}${override && a.id === chosenId ? " (reviewer's choice)" : ''}`,
      formatSig(a.score),
      formatEstimate(a.cells),
      formatEstimate(a.timeSteps),
      formatEstimate(a.coreHours),
      formatDuration(a.wallClockHours),
      formatQuantity(a.memoryGB, 'GB', 2),
      a.feasible ? 'yes' : 'no',
    ]),
  )
  w.paragraph(`Steps are iterations for steady RANS and time steps otherwise; wall-clock on ${formatSig(decision.caseInput.budget.cores)} cores. Budget: ${formatQuantity(decision.caseInput.budget.coreHours, 'core-h')}, ${formatQuantity(decision.caseInput.budget.wallClockHours, 'h')} wall-clock.`, { size: 8, color: MUTED })

  // Rules
  w.heading('Rules that fired, with their sources')
  const fired = advice.trace.filter((t) => t.fired)
  if (!fired.length) w.paragraph('No rule fired: the base scores and the cost model decided.')
  for (const rule of fired) {
    w.ensure(50)
    w.paragraph(`${rule.title}`, { font: REPORT_FONTS.bold })
    w.paragraph(`rule ${rule.rule} · ${rule.stage} stage`, { font: REPORT_FONTS.mono, size: 7.5, color: MUTED })
    w.paragraph(markdownToPlain(rule.why), { size: 8.5 })
    w.paragraph(`Source: ${rule.source}`, { size: 8, color: MUTED })
    doc.moveDown(0.4)
  }

  writeVerification(w, data.verification)

  // History
  w.heading('History (append-only, hash-chained)')
  const rows: (string[] | { note: string })[] = []
  for (const event of events) {
    rows.push([String(event.seq), utc(event.createdAt), event.type, event.actor.name, ROLE_LABELS[event.actorRole as Role] ?? event.actorRole, event.hash.slice(0, 16)])
    const { note } = eventDetails(event.payload)
    if (note) rows.push({ note })
  }
  w.table(
    [{ header: '#', width: 0.35 }, { header: 'Time (UTC)', width: 2.05 }, { header: 'Event', width: 1.55 }, { header: 'Actor', width: 1.4 }, { header: 'Role', width: 1.2 }, { header: 'Hash (first 16 hex)', width: 1.75 }],
    rows,
    { mono: [2, 5] },
  )
  const lastHash = events.at(-1)?.hash ?? '—'
  w.ensure(40)
  if (chain.valid) {
    w.paragraph(`Chain intact: ${chain.checked} ${chain.checked === 1 ? 'event' : 'events'} recomputed, each linked to the one before; events, revisions and the decision's state agree with the ledger.`, { font: REPORT_FONTS.bold, color: ACCENT })
  } else {
    if (chain.brokenAt !== null) {
      w.paragraph(`Chain broken at event ${chain.brokenAt} (${chain.checked} checked): the record may have been altered. Do not rely on this history.`, { font: REPORT_FONTS.bold, color: '#a61b1b' })
    }
    // What the ledger check found besides (or instead of) a broken chain: a forged status or override, a rehashed event...
    for (const problem of chain.problems.slice(0, 6)) {
      w.paragraph(`Ledger check failed (${problem.kind}): ${problem.detail}. Do not rely on the status, override or history shown here.`, { font: REPORT_FONTS.bold, color: '#a61b1b' })
    }
  }
  w.paragraph(`Last hash: ${lastHash}`, { font: REPORT_FONTS.mono, size: 7.5 })

  // Provenance
  w.heading('Provenance')
  w.fields([
    ['Ruleset', `${provenance.rulesetId} version ${provenance.rulesetVersion}`],
    ['Engine version', provenance.engineVersion],
    ['Input hash (sha256)', provenance.inputHash],
    ['Record state', `version ${decision.version}, revision ${decision.revision}, updated ${utc(decision.updatedAt)}`],
    ['Generated at', utc(generatedAt)],
  ])

  // Footer on every page, drawn once the page count is known.
  const range = doc.bufferedPageRange()
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i)
    const page = doc.page
    page.margins.bottom = 0
    const y = page.height - MARGIN.bottom + 18
    doc.moveTo(MARGIN.left, y - 6).lineTo(page.width - MARGIN.right, y - 6).lineWidth(0.4).strokeColor(RULE).stroke()
    doc.font(REPORT_FONTS.sans).fontSize(7).fillColor(MUTED)
      .text(FOOTER_CAUTION, MARGIN.left, y, { width: w.width - 90 })
    doc.text(`page ${i - range.start + 1} of ${range.count}`, page.width - MARGIN.right - 85, y, { width: 85, align: 'right' })
    doc.text(`${project.code} · decision ${decision.id} · v${decision.version}`, page.width - MARGIN.right - 85, y + 9, { width: 85, align: 'right' })
  }
  doc.end()
  return done
}
