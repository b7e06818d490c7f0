// The PDF record of a decision, for QA to file: what was asked, what the engine advised, what the
// reviewer decided, and the verified history, laid out in our own words with pdfkit's standard fonts.
import { marked, type Token } from 'marked'
import PDFDocument from 'pdfkit'
import { APPROACH_LABELS, GENERAL_CAUTIONS, WALL_TREATMENT_LABELS, type ApproachId, type WallTreatment } from '../../shared/rules'
import { DECISION_STATUS_LABELS } from '../../shared/schemas/decisions'
import { ROLE_LABELS, type Role } from '../../shared/utils/roles'
import { GEOMETRY_LABELS, MEDIUM_LABELS, PHYSICS_LABELS, QUANTITY_LABELS, REGIME_LABELS, SEPARATION_LABELS } from '../../app/utils/case-labels'
import { formatPercent, formatQuantity, formatSci, formatSig } from '../../app/utils/format'

/** Everything the record shows, read once so that the PDF is one consistent state. */
export async function loadDecisionReport(decisionId: number) {
  const decision = await readDecision(decisionId)
  const [project, events, chain, revision] = await Promise.all([
    projectHeading(decision.projectId),
    listEvents(decisionId),
    verifyChain(useDb(), decisionId),
    readRevision(decisionId, decision.revision),
  ])
  return {
    decision,
    project: project!,
    events,
    chain,
    provenance: { rulesetId: revision.rulesetId, rulesetVersion: revision.rulesetVersion, engineVersion: revision.engineVersion, inputHash: revision.inputHash },
  }
}
export type DecisionReportData = Awaited<ReturnType<typeof loadDecisionReport>>

export function decisionReportFilename(data: Pick<DecisionReportData, 'decision' | 'project'>) {
  const code = data.project.code.replace(/[^A-Za-z0-9_-]+/g, '_')
  return `eddyledger-${code}-decision-${data.decision.id}-v${data.decision.version}.pdf`
}

// ---- text for the standard fonts

// The standard PDF fonts carry Windows-1252 glyphs only: the rest is spelled out.
const WIN_ANSI_EXTRA = new Set('€‚ƒ„…†‡ˆ‰Š‹ŒŽ‘’“”•–—˜™š›œžŸ')
const SPELLED: Record<string, string> = {
  '\u2212': '-', '\u202f': ' ', '\u2009': ' ', '\u2011': '-', '∞': 'infinity', '≈': '~', '≤': '<=', '≥': '>=',
  '→': '->', '←': '<-', '·': '·', 'δ': 'delta', 'ε': 'epsilon', 'ω': 'omega', 'ν': 'nu', 'μ': 'mu', 'τ': 'tau', 'ρ': 'rho',
  'Δ': 'Delta', 'κ': 'kappa', 'η': 'eta', 'θ': 'theta', 'γ': 'gamma', 'σ': 'sigma', 'α': 'alpha', 'β': 'beta',
}
const SUPERSCRIPT_DIGITS = '⁰¹²³⁴⁵⁶⁷⁸⁹'
const EXPONENT = /×10([⁻⁰¹²³⁴⁵⁶⁷⁸⁹]+)/g
const HAS_EXPONENT = /×10[⁻⁰¹²³⁴⁵⁶⁷⁸⁹]/

function plainExponent(sup: string) {
  return sup.replace('⁻', '-').replace(/[⁰¹²³⁴⁵⁶⁷⁸⁹]/g, (c) => String(SUPERSCRIPT_DIGITS.indexOf(c)))
}

/**
 * Text the standard fonts can show: a superscript power of ten written as ×10^7, other symbols
 * spelled out, accents kept where Windows-1252 has them, anything else a question mark.
 */
export function reportText(text: string): string {
  return text.replace(EXPONENT, (_, sup: string) => `×10^${plainExponent(sup)}`)
    .split('')
    .map((c) => {
      if (c in SPELLED) return SPELLED[c]
      const code = c.charCodeAt(0)
      if (code < 0x80 || (code >= 0xa0 && code <= 0xff) || WIN_ANSI_EXTRA.has(c)) return c
      const base = c.normalize('NFKD').replace(/[\u0300-\u036f]/g, '')
      return base && [...base].every((b) => b.charCodeAt(0) < 0x100) ? base : '?'
    })
    .join('')
}

/** A rule's markdown rationale as plain sentences: list items on their own lines, no markup. */
export function markdownToPlain(markdown: string): string {
  const inline = (tokens: Token[] | undefined): string => (tokens ?? []).map((t) => {
    if ('tokens' in t && t.tokens) return inline(t.tokens)
    if (t.type === 'br') return '\n'
    if (t.type === 'html') return ''
    return 'text' in t ? String(t.text) : ''
  }).join('')
  const block = (tokens: Token[]): string[] => tokens.flatMap((t): string[] => {
    if (t.type === 'space' || t.type === 'hr' || t.type === 'html') return []
    if (t.type === 'list') return t.items.map((item: { tokens: Token[] }) => `• ${block(item.tokens).join(' ')}`)
    if (t.type === 'code') return [t.text]
    if (t.type === 'blockquote') return block(t.tokens ?? [])
    if ('tokens' in t && t.tokens) return [inline(t.tokens)]
    return 'text' in t ? [String(t.text)] : []
  })
  return block(marked.lexer(markdown)).map((line) => line.replace(/&(amp|lt|gt|quot|#39);/g, (_, e: string) => (
    { amp: '&', lt: '<', gt: '>', quot: '"', '#39': "'" } as Record<string, string>)[e]!)).join('\n')
}

const utc = (date: Date | string) => new Date(date).toISOString().replace('T', ' ').replace(/\.\d{3}Z$/, ' UTC')
const approachLabel = (id: string) => APPROACH_LABELS[id as ApproachId] ?? id
const treatmentLabel = (id: string) => WALL_TREATMENT_LABELS[id as WallTreatment] ?? id

/** One line for the footer of every page: the general cautions in brief. */
const FOOTER_CAUTION = "Order-of-magnitude estimates for planning; verify y+ on the real solution. Your organisation's procedures, local codes and licensed engineering practice take precedence."

// ---- layout

const INK = '#1d2730'
const MUTED = '#5b6673'
const ACCENT = '#0e5a66'
const RULE = '#c9d1d8'
const CAUTION_FILL = '#fbf3e2'
const CAUTION_EDGE = '#b07a12'
const MARGIN = { top: 54, bottom: 66, left: 50, right: 50 }

type Column = { header: string; width: number; align?: 'left' | 'right' }

class ReportWriter {
  readonly doc: PDFKit.PDFDocument
  readonly width: number
  constructor(doc: PDFKit.PDFDocument) {
    this.doc = doc
    this.width = doc.page.width - MARGIN.left - MARGIN.right
  }

  get bottom() { return this.doc.page.height - MARGIN.bottom }

  ensure(height: number) {
    if (this.doc.y + height > this.bottom) this.doc.addPage()
  }

  heading(text: string) {
    const { doc } = this
    this.ensure(60)
    doc.y += 10
    doc.font('Helvetica-Bold').fontSize(11.5).fillColor(ACCENT).text(reportText(text), MARGIN.left, doc.y, { width: this.width })
    doc.moveTo(MARGIN.left, doc.y + 2).lineTo(MARGIN.left + this.width, doc.y + 2).lineWidth(0.6).strokeColor(ACCENT).stroke()
    doc.y += 7
  }

  paragraph(text: string, options: { size?: number; color?: string; font?: string; indent?: number } = {}) {
    const { doc } = this
    const indent = options.indent ?? 0
    doc.font(options.font ?? 'Helvetica').fontSize(options.size ?? 9).fillColor(options.color ?? INK)
    const body = reportText(text)
    this.ensure(Math.min(doc.heightOfString(body, { width: this.width - indent }), 40))
    doc.text(body, MARGIN.left + indent, doc.y, { width: this.width - indent })
  }

  /** A value drawn on one line, with a power of ten as a real superscript. */
  value(text: string, x: number, y: number, width: number, align: 'left' | 'right', size: number) {
    const { doc } = this
    const parts: { text: string; sup: boolean }[] = []
    let last = 0
    for (const match of text.matchAll(EXPONENT)) {
      parts.push({ text: text.slice(last, match.index) + '×10', sup: false }, { text: plainExponent(match[1]!), sup: true })
      last = match.index! + match[0].length
    }
    parts.push({ text: text.slice(last), sup: false })
    const measured = parts.map((p) => ({ ...p, text: reportText(p.text), size: p.sup ? size * 0.72 : size }))
    const total = measured.reduce((sum, p) => sum + doc.fontSize(p.size).widthOfString(p.text), 0)
    let cursor = align === 'right' ? x + width - total : x
    for (const p of measured) {
      doc.fontSize(p.size).text(p.text, cursor, p.sup ? y - size * 0.28 : y, { lineBreak: false })
      cursor += doc.widthOfString(p.text)
    }
    doc.fontSize(size)
  }

  /**
   * A table: a shaded header row repeated on every page it spans, wrapped text cells, numbers on
   * one line. `note` rows span the width under the row before (an event's comment).
   */
  table(columns: Column[], rows: (string[] | { note: string })[], options: { size?: number; mono?: number[] } = {}) {
    const { doc } = this
    const size = options.size ?? 8.5
    const scale = this.width / columns.reduce((sum, c) => sum + c.width, 0)
    const widths = columns.map((c) => c.width * scale)
    const pad = 3
    const header = () => {
      doc.font('Helvetica-Bold').fontSize(size)
      const height = Math.max(...columns.map((c, i) => doc.heightOfString(reportText(c.header), { width: widths[i]! - 2 * pad }))) + 2 * pad
      this.ensure(height + 14)
      const top = doc.y
      doc.rect(MARGIN.left, top, this.width, height).fill('#e8eef1')
      let x = MARGIN.left
      doc.fillColor(INK)
      columns.forEach((c, i) => {
        doc.text(reportText(c.header), x + pad, top + pad, { width: widths[i]! - 2 * pad, align: c.align ?? 'left' })
        x += widths[i]!
      })
      doc.y = top + height
    }
    header()
    for (const row of rows) {
      if (!Array.isArray(row)) {
        doc.font('Helvetica-Oblique').fontSize(size)
        const text = reportText(row.note)
        const height = doc.heightOfString(text, { width: this.width - 6 * pad }) + 2 * pad
        if (doc.y + height > this.bottom) { doc.addPage(); header() }
        doc.fillColor(INK).text(text, MARGIN.left + 3 * pad, doc.y + pad, { width: this.width - 6 * pad })
        doc.y += pad
        doc.moveTo(MARGIN.left, doc.y).lineTo(MARGIN.left + this.width, doc.y).lineWidth(0.3).strokeColor(RULE).stroke()
        continue
      }
      const fontOf = (i: number) => (options.mono?.includes(i) ? 'Courier' : 'Helvetica')
      const heights = row.map((cell, i) => doc.font(fontOf(i)).fontSize(size).heightOfString(reportText(cell), { width: widths[i]! - 2 * pad }))
      const height = Math.max(...heights) + 2 * pad
      if (doc.y + height > this.bottom) { doc.addPage(); header() }
      const top = doc.y
      let x = MARGIN.left
      row.forEach((cell, i) => {
        const align = columns[i]!.align ?? 'left'
        doc.font(fontOf(i)).fontSize(size).fillColor(INK)
        if (align === 'right') this.value(cell, x + pad, top + pad, widths[i]! - 2 * pad, 'right', size)
        else doc.text(reportText(cell), x + pad, top + pad, { width: widths[i]! - 2 * pad })
        x += widths[i]!
      })
      doc.y = top + height
      doc.moveTo(MARGIN.left, doc.y).lineTo(MARGIN.left + this.width, doc.y).lineWidth(0.3).strokeColor(RULE).stroke()
    }
    doc.x = MARGIN.left
    doc.y += 4
  }

  /** Label and value pairs, two to a line when `columns` is 2. */
  fields(rows: [string, string][], columns: 1 | 2 = 1) {
    const { doc } = this
    const gap = 14
    const cellWidth = (this.width - (columns - 1) * gap) / columns
    const labelWidth = columns === 1 ? 150 : 78
    for (let i = 0; i < rows.length; i += columns) {
      const line = rows.slice(i, i + columns)
      const heights = line.map(([label, value]) => Math.max(
        doc.font('Helvetica').fontSize(8.5).heightOfString(reportText(label), { width: labelWidth - 4 }),
        doc.font('Helvetica').fontSize(9).heightOfString(reportText(value), { width: cellWidth - labelWidth }),
      ))
      const height = Math.max(...heights) + 3
      this.ensure(height)
      const top = doc.y
      line.forEach(([label, value], j) => {
        const x = MARGIN.left + j * (cellWidth + gap)
        // The smaller label sits on the value's baseline.
        doc.font('Helvetica').fontSize(8.5).fillColor(MUTED).text(reportText(label), x, top + 0.6, { width: labelWidth - 4 })
        doc.font('Helvetica').fontSize(9).fillColor(INK)
        if (HAS_EXPONENT.test(value) && doc.widthOfString(reportText(value)) < cellWidth - labelWidth) this.value(value, x + labelWidth, top, cellWidth - labelWidth, 'left', 9)
        else doc.text(reportText(value), x + labelWidth, top, { width: cellWidth - labelWidth })
      })
      doc.y = top + height
    }
    doc.x = MARGIN.left
  }

  /** The cautions, framed, on the first page. */
  cautions(items: string[]) {
    const { doc } = this
    const pad = 8
    doc.font('Helvetica').fontSize(8.5)
    const texts = items.map((c) => reportText(c))
    const bodyHeight = texts.reduce((sum, t) => sum + doc.heightOfString(t, { width: this.width - 2 * pad - 10 }) + 2, 0)
    const height = bodyHeight + 2 * pad + 14
    this.ensure(height)
    const top = doc.y
    doc.rect(MARGIN.left, top, this.width, height).fillAndStroke(CAUTION_FILL, CAUTION_EDGE)
    doc.font('Helvetica-Bold').fontSize(9).fillColor(CAUTION_EDGE).text('Cautions: read before using this record', MARGIN.left + pad, top + pad, { width: this.width - 2 * pad })
    doc.y += 3
    doc.font('Helvetica').fontSize(8.5).fillColor(INK)
    for (const t of texts) {
      const y = doc.y
      doc.text('•', MARGIN.left + pad, y, { lineBreak: false })
      doc.text(t, MARGIN.left + pad + 10, y, { width: this.width - 2 * pad - 10 })
      doc.y += 2
    }
    doc.x = MARGIN.left
    doc.y = top + height + 6
  }
}

// ---- content

const INPUT_FIGURES = 6

function caseRows(data: DecisionReportData): [string, string][] {
  const input = data.decision.caseInput
  const { advice } = data.decision
  const internal = input.regime === 'internal'
  const ticked = Object.entries(input.physics ?? {}).filter(([, on]) => on).map(([k]) => PHYSICS_LABELS[k as keyof typeof PHYSICS_LABELS] ?? k)
  // The engineer's own inputs are recorded as entered (up to INPUT_FIGURES figures), not rounded.
  const given = (value: number | undefined, unit: string, otherwise: string) => (value === undefined ? otherwise : formatQuantity(value, unit, INPUT_FIGURES))
  return [
    ['Flow regime', REGIME_LABELS[input.regime]],
    ['Geometry', GEOMETRY_LABELS[input.geometry]],
    ['Separation expected', SEPARATION_LABELS[input.separation]],
    ['Fluid', MEDIUM_LABELS[input.fluid.medium]],
    ['Temperature', given(input.fluid.temperatureK, 'K', 'not given (the engine default for the fluid)')],
    ...(input.fluid.medium === 'air' ? [['Static pressure', given(input.fluid.pressurePa, 'Pa', 'not given (one standard atmosphere)')] as [string, string]] : []),
    ['Density used', formatQuantity(advice.fluid.density, 'kg/m³')],
    ['Dynamic viscosity used', formatQuantity(advice.fluid.viscosity, 'Pa·s')],
    ['Kinematic viscosity', formatQuantity(advice.fluid.kinematicViscosity, 'm²/s')],
    [internal ? 'Bulk velocity' : 'Free-stream velocity', formatQuantity(input.velocity, 'm/s', INPUT_FIGURES)],
    [internal ? 'Hydraulic diameter' : 'Reference length', formatQuantity(input.length, 'm', INPUT_FIGURES)],
    ...(internal ? [['Wall roughness (sand-grain)', given(input.roughness, 'm', 'smooth wall')] as [string, string]] : []),
    ['Turbulence intensity', `${formatSig(input.turbulenceIntensity, INPUT_FIGURES)} (${formatPercent(input.turbulenceIntensity, INPUT_FIGURES)})`],
    ['Physics', ticked.length ? ticked.join('; ') : 'none ticked'],
    ['Quantities of interest', input.quantities.map((q) => QUANTITY_LABELS[q] ?? q).join('; ')],
    ['Core-hour budget', formatQuantity(input.budget.coreHours, 'core-h', INPUT_FIGURES)],
    ['Cores', `${formatSig(input.budget.cores, INPUT_FIGURES)} cores`],
    ['Wall-clock budget', formatQuantity(input.budget.wallClockHours, 'h', INPUT_FIGURES)],
    ['Target y+', input.yPlusTarget === undefined ? "not set (the wall treatment's own)" : `${formatSig(input.yPlusTarget, INPUT_FIGURES)} (dimensionless)`],
    ['Growth ratio', `${formatSig(input.growthRatio, INPUT_FIGURES)} (dimensionless)`],
    ['Reynolds number', `${formatSig(advice.reynolds)} (dimensionless)`],
    ...(advice.mach !== null ? [['Mach number', `${formatSig(advice.mach)} (dimensionless)`] as [string, string]] : []),
  ]
}

function wallRows(wall: DecisionReportData['decision']['advice']['wall']): [string, string][] {
  return [
    ['Wall treatment', treatmentLabel(wall.wallTreatment)],
    ['Target y+ (first cell centre)', `${formatSig(wall.yPlusTarget)} (dimensionless)`],
    ['First-cell-centre distance', formatQuantity(wall.firstCellCentre, 'm')],
    ['First-cell height (2 × centre)', formatQuantity(wall.firstCellHeight, 'm')],
    ['Wall shear stress', formatQuantity(wall.wallShearStress, 'Pa')],
    ['Friction velocity', formatQuantity(wall.frictionVelocity, 'm/s')],
    ['Boundary-layer thickness', formatQuantity(wall.boundaryLayerThickness, 'm')],
    ['Layers to the boundary-layer edge', `${formatSig(wall.layers)} layers`],
    ['Growth ratio', `${formatSig(wall.growthRatio)} (dimensionless)`],
    ['Skin-friction coefficient', `${formatSig(wall.skinFriction)} (dimensionless)`],
  ]
}

function eventDetails(payload: unknown): { note?: string } {
  const p = (payload && typeof payload === 'object' ? payload : {}) as Record<string, unknown>
  const parts: string[] = []
  if (typeof p.revision === 'number') parts.push(`revision ${p.revision}`)
  if (typeof p.approach === 'string') parts.push(`chose ${approachLabel(p.approach)}`)
  if (typeof p.model === 'string') parts.push(`model ${p.model}`)
  if (typeof p.wallTreatment === 'string') parts.push(treatmentLabel(p.wallTreatment))
  if (Array.isArray(p.disagreedRules) && p.disagreedRules.length) parts.push(`disagreed with rule ${p.disagreedRules.join(', ')}`)
  if (typeof p.supersedes === 'number') parts.push(`supersedes decision ${p.supersedes}`)
  if (typeof p.supersededBy === 'number') parts.push(`superseded by decision ${p.supersededBy}`)
  const comment = typeof p.comment === 'string' && p.comment.trim() ? `"${p.comment.trim()}"` : ''
  const note = [parts.join('; '), comment].filter(Boolean).join(' — ')
  return note ? { note } : {}
}

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
      Title: reportText(`${project.code} decision ${decision.id} v${decision.version}: ${decision.title}`),
      Author: reportText(decision.author.name),
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
  const w = new ReportWriter(doc)

  // Header
  doc.font('Helvetica-Bold').fontSize(9).fillColor(ACCENT).text('EDDYLEDGER · DECISION RECORD', MARGIN.left, MARGIN.top, { characterSpacing: 0.6 })
  doc.font('Helvetica').fontSize(9).fillColor(MUTED).text(reportText(`Project ${project.code} · ${project.name}`))
  doc.moveDown(0.3)
  doc.font('Helvetica-Bold').fontSize(16).fillColor(INK).text(reportText(decision.title), { width: w.width })
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
    ],
  )
  if (override) {
    w.paragraph(`Overridden by ${override.reviewer.name}. Reviewer's reason:`, { font: 'Helvetica-Bold' })
    w.paragraph(override.comment, { indent: 10 })
    doc.moveDown(0.3)
    const titles = new Map(advice.trace.map((t) => [t.rule, t.title]))
    w.paragraph('Rules the reviewer disagreed with:', { font: 'Helvetica-Bold' })
    w.paragraph(override.disagreedRules.length
      ? override.disagreedRules.map((id) => `• ${id}${titles.has(id) ? `: ${titles.get(id)}` : ''}`).join('\n')
      : 'none named', { indent: 10 })
  } else if (decision.status === 'approved') {
    const approval = [...events].reverse().find((e) => e.type === 'approved')
    if (approval) w.paragraph(`Approved by ${approval.actor.name} on ${utc(approval.createdAt)}.`)
  }

  // Case input
  w.heading('Case input (SI units)')
  w.fields(caseRows(data))

  // Near-wall mesh
  w.heading(override ? "Near-wall mesh for the reviewer's choice (recomputed)" : 'Near-wall mesh')
  w.paragraph('Cell-centred mesh: the first-cell height is twice the distance of its centre from the wall. Flat-plate or pipe correlations; check y+ on the real solution.', { size: 8, color: MUTED })
  doc.moveDown(0.3)
  w.fields(wallRows(override?.wall ?? advice.wall))

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
      formatSci(a.cells),
      formatSci(a.timeSteps),
      formatSci(a.coreHours),
      formatQuantity(a.wallClockHours, 'h'),
      formatQuantity(a.memoryGB, 'GB'),
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
    w.paragraph(`${rule.title}`, { font: 'Helvetica-Bold' })
    w.paragraph(`rule ${rule.rule} · ${rule.stage} stage`, { font: 'Courier', size: 7.5, color: MUTED })
    w.paragraph(markdownToPlain(rule.why), { size: 8.5 })
    w.paragraph(`Source: ${rule.source}`, { size: 8, color: MUTED })
    doc.moveDown(0.4)
  }

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
    w.paragraph(`Chain intact: ${chain.checked} ${chain.checked === 1 ? 'event' : 'events'} recomputed, each linked to the one before.`, { font: 'Helvetica-Bold', color: ACCENT })
  } else {
    w.paragraph(`Chain broken at event ${chain.brokenAt ?? '?'} (${chain.checked} checked): the record may have been altered. Do not rely on this history.`, { font: 'Helvetica-Bold', color: '#a61b1b' })
  }
  w.paragraph(`Last hash: ${lastHash}`, { font: 'Courier', size: 7.5 })

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
    doc.font('Helvetica').fontSize(7).fillColor(MUTED)
      .text(reportText(FOOTER_CAUTION), MARGIN.left, y, { width: w.width - 90 })
    doc.text(`page ${i - range.start + 1} of ${range.count}`, page.width - MARGIN.right - 85, y, { width: 85, align: 'right' })
    doc.text(reportText(`${project.code} · decision ${decision.id} · v${decision.version}`), page.width - MARGIN.right - 85, y + 9, { width: 85, align: 'right' })
  }
  doc.end()
  return done
}
