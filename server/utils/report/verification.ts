// The record's "after the run" section: the wall y+ checks against the signed-off band, the
// grid-convergence studies and the runs' actual compute, retracted records marked, not hidden.
import { APPROACH_LABELS } from '#shared/rules'
import { HOURS_UNIT } from '#shared/verification'
import { formatPercent, formatQuantity, formatSci, formatSig } from '#shared/utils/format'
import type { DecisionReportData } from './data'
import { REPORT_FONTS } from './fonts'
import { MUTED, type ReportWriter } from './layout'
import { utc } from './sections'

type Verification = NonNullable<DecisionReportData['verification']>

export function writeVerification(w: ReportWriter, verification: DecisionReportData['verification']) {
  w.heading('After the run: verification')
  if (!verification) {
    w.paragraph('Not signed off: verification is recorded once a reviewer approves or overrides the decision.')
    return
  }
  const v = verification
  w.paragraph(`Band checked: ${v.signedOff.band.label}. Pass mark: ${formatPercent(v.passFraction, 3)} of the wall inside the band (the mark in force when each check was made is shown with it).`, { size: 8.5 })
  wallChecks(w, v)
  gridStudies(w, v)
  runs(w, v)
  w.paragraph('y+ bands and the pass mark are common practice, not a standard; the GCI estimates, it does not bound, the discretisation error (Celik et al. 2008, ASME J. Fluids Eng. 130, 078001; Roache 1994).', { size: 8, color: MUTED })
}

function wallChecks(w: ReportWriter, v: Verification) {
  w.paragraph('Wall y+ checks', { font: REPORT_FONTS.bold })
  if (!v.wallChecks.length) {
    w.paragraph('None recorded.', { indent: 10 })
    return
  }
  const rows: (string[] | { note: string })[] = []
  for (const c of v.wallChecks) {
    rows.push([
      `${c.id}${c.retraction ? ' (retracted)' : ''}`,
      c.fileName,
      formatSig(c.rows, 4),
      c.areaWeighted ? 'area' : 'faces',
      formatPercent(c.fractionBelow, 3),
      formatPercent(c.fractionInBand, 3),
      formatPercent(c.fractionAbove, 3),
      `${c.verdict} (${formatPercent(c.passFraction, 3)})`,
      c.review ? `${c.review.accepted ? 'accepted' : 'rejected'} by ${c.reviewerName ?? 'reviewer'}` : 'pending',
    ])
    const notes = [`sha256 ${c.fileSha256}; uploaded by ${c.uploadedByName ?? 'someone'} ${utc(c.createdAt)}`]
    if (c.review?.comment) notes.push(`review: "${c.review.comment}"`)
    if (c.retraction) notes.push(`retracted: "${c.retraction.reason}"`)
    notes.push(...c.cautions)
    rows.push({ note: notes.join(' — ') })
  }
  w.table(
    [
      { header: '#', width: 0.4 }, { header: 'File', width: 1.9 }, { header: 'Faces', width: 0.8, align: 'right' }, { header: 'By', width: 0.6 },
      { header: 'Below', width: 0.8, align: 'right' }, { header: 'Inside', width: 0.8, align: 'right' }, { header: 'Above', width: 0.8, align: 'right' },
      { header: 'Verdict', width: 1.2 }, { header: 'Review', width: 1.6 },
    ],
    rows,
  )
}

function gridStudies(w: ReportWriter, v: Verification) {
  w.paragraph('Grid-convergence studies (Celik et al. 2008)', { font: REPORT_FONTS.bold })
  if (!v.gridStudies.length) {
    w.paragraph('None recorded.', { indent: 10 })
    return
  }
  const rows: (string[] | { note: string })[] = []
  for (const s of v.gridStudies) {
    rows.push([
      `${s.id}${s.retraction ? ' (retracted)' : ''}`,
      `${s.quantity}${s.unit ? ` (${s.unit})` : ''}, ${s.dimensions}-D`,
      s.grids.filter(g => g.used).map(g => formatSci(g.cells)).join(' / '),
      formatSig(s.order, 3),
      s.extrapolated === null ? '—' : formatQuantity(s.extrapolated, s.unit, 5),
      formatPercent(s.gciFine, 3),
      s.convergence,
    ])
    const notes = [...s.warnings, ...(s.retraction ? [`retracted: "${s.retraction.reason}"`] : [])]
    if (notes.length) rows.push({ note: notes.join(' — ') })
  }
  w.table(
    [
      { header: '#', width: 0.4 }, { header: 'Quantity', width: 2.2 }, { header: 'Cells used', width: 1.8 }, { header: 'Order p', width: 0.8, align: 'right' },
      { header: 'Extrapolated', width: 1.2, align: 'right' }, { header: 'GCI fine', width: 0.9, align: 'right' }, { header: 'Convergence', width: 1.1 },
    ],
    rows,
  )
}

function runs(w: ReportWriter, v: Verification) {
  w.paragraph('Runs: actual compute against the estimate', { font: REPORT_FONTS.bold })
  if (!v.runs.length) {
    w.paragraph('None recorded.', { indent: 10 })
    return
  }
  const rows: (string[] | { note: string })[] = []
  for (const r of v.runs) {
    rows.push([
      `${r.id}${r.retraction ? ' (retracted)' : ''}`,
      `${APPROACH_LABELS[r.approach]}, ${r.hardware.toUpperCase()}`,
      formatSci(r.cells),
      formatSci(r.timeSteps),
      `${formatSci(r.coreHours)} ${HOURS_UNIT[r.hardware]}`,
      r.estimated ? `${formatSci(r.estimated.coreHours)} core-h` : '—',
      `${formatSci(r.coreSecondsPerCellStep)} ${r.hardware === 'gpu' ? 'GPU-s' : 'core-s'}`,
      formatQuantity(r.wallClockHours, 'h'),
    ])
    const notes = [[r.hardwareNote, r.solverFamily].filter(Boolean).join('; '), ...r.cautions, ...(r.retraction ? [`retracted: "${r.retraction.reason}"`] : [])].filter(Boolean)
    if (notes.length) rows.push({ note: notes.join(' — ') })
  }
  w.table(
    [
      { header: '#', width: 0.4 }, { header: 'Approach', width: 2 }, { header: 'Cells', width: 0.9, align: 'right' }, { header: 'Steps', width: 0.9, align: 'right' },
      { header: 'Used', width: 1.2, align: 'right' }, { header: 'Estimated', width: 1.2, align: 'right' }, { header: 'Per cell-step', width: 1.2, align: 'right' },
      { header: 'Wall-clock', width: 0.9, align: 'right' },
    ],
    rows,
  )
}
