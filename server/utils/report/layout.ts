// The PDF's layout in our own design: headings, paragraphs, tables repeated across pages, label and
// value pairs, and the framed cautions. Text goes out as typed: the embedded fonts (fonts.ts) carry
// Greek, Cyrillic, accented Latin and the superscript digits of a power of ten.
import { REPORT_FONTS } from './fonts'

export const INK = '#1d2730'
export const MUTED = '#5b6673'
export const ACCENT = '#0e5a66'
export const RULE = '#c9d1d8'
export const CAUTION_FILL = '#fbf3e2'
export const CAUTION_EDGE = '#b07a12'
export const MARGIN = { top: 54, bottom: 66, left: 50, right: 50 }

type Column = { header: string; width: number; align?: 'left' | 'right' }

export class ReportWriter {
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
    doc.font(REPORT_FONTS.bold).fontSize(11.5).fillColor(ACCENT).text(text, MARGIN.left, doc.y, { width: this.width })
    doc.moveTo(MARGIN.left, doc.y + 2).lineTo(MARGIN.left + this.width, doc.y + 2).lineWidth(0.6).strokeColor(ACCENT).stroke()
    doc.y += 7
  }

  paragraph(text: string, options: { size?: number; color?: string; font?: string; indent?: number } = {}) {
    const { doc } = this
    const indent = options.indent ?? 0
    doc.font(options.font ?? REPORT_FONTS.sans).fontSize(options.size ?? 9).fillColor(options.color ?? INK)
    const body = text
    this.ensure(Math.min(doc.heightOfString(body, { width: this.width - indent }), 40))
    doc.text(body, MARGIN.left + indent, doc.y, { width: this.width - indent })
  }

  /** A value on one line, aligned in its cell. */
  value(text: string, x: number, y: number, width: number, align: 'left' | 'right', size: number) {
    this.doc.fontSize(size).text(text, x, y, { width, align, lineBreak: false })
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
      doc.font(REPORT_FONTS.bold).fontSize(size)
      const height = Math.max(...columns.map((c, i) => doc.heightOfString(c.header, { width: widths[i]! - 2 * pad }))) + 2 * pad
      this.ensure(height + 14)
      const top = doc.y
      doc.rect(MARGIN.left, top, this.width, height).fill('#e8eef1')
      let x = MARGIN.left
      doc.fillColor(INK)
      columns.forEach((c, i) => {
        doc.text(c.header, x + pad, top + pad, { width: widths[i]! - 2 * pad, align: c.align ?? 'left' })
        x += widths[i]!
      })
      doc.y = top + height
    }
    header()
    for (const row of rows) {
      if (!Array.isArray(row)) {
        doc.font(REPORT_FONTS.oblique).fontSize(size)
        const text = row.note
        const height = doc.heightOfString(text, { width: this.width - 6 * pad }) + 2 * pad
        if (doc.y + height > this.bottom) { doc.addPage(); header() }
        doc.fillColor(INK).text(text, MARGIN.left + 3 * pad, doc.y + pad, { width: this.width - 6 * pad })
        doc.y += pad
        doc.moveTo(MARGIN.left, doc.y).lineTo(MARGIN.left + this.width, doc.y).lineWidth(0.3).strokeColor(RULE).stroke()
        continue
      }
      const fontOf = (i: number) => (options.mono?.includes(i) ? REPORT_FONTS.mono : REPORT_FONTS.sans)
      const heights = row.map((cell, i) => doc.font(fontOf(i)).fontSize(size).heightOfString(cell, { width: widths[i]! - 2 * pad }))
      const height = Math.max(...heights) + 2 * pad
      if (doc.y + height > this.bottom) { doc.addPage(); header() }
      const top = doc.y
      let x = MARGIN.left
      row.forEach((cell, i) => {
        const align = columns[i]!.align ?? 'left'
        doc.font(fontOf(i)).fontSize(size).fillColor(INK)
        if (align === 'right') this.value(cell, x + pad, top + pad, widths[i]! - 2 * pad, 'right', size)
        else doc.text(cell, x + pad, top + pad, { width: widths[i]! - 2 * pad })
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
        doc.font(REPORT_FONTS.sans).fontSize(8.5).heightOfString(label, { width: labelWidth - 4 }),
        doc.font(REPORT_FONTS.sans).fontSize(9).heightOfString(value, { width: cellWidth - labelWidth }),
      ))
      const height = Math.max(...heights) + 3
      this.ensure(height)
      const top = doc.y
      line.forEach(([label, value], j) => {
        const x = MARGIN.left + j * (cellWidth + gap)
        // The smaller label sits on the value's baseline.
        doc.font(REPORT_FONTS.sans).fontSize(8.5).fillColor(MUTED).text(label, x, top + 0.6, { width: labelWidth - 4 })
        doc.font(REPORT_FONTS.sans).fontSize(9).fillColor(INK)
        doc.text(value, x + labelWidth, top, { width: cellWidth - labelWidth })
      })
      doc.y = top + height
    }
    doc.x = MARGIN.left
  }

  /** The cautions, framed, on the first page. */
  cautions(items: string[]) {
    const { doc } = this
    const pad = 8
    doc.font(REPORT_FONTS.sans).fontSize(8.5)
    const texts = items.map((c) => c)
    const bodyHeight = texts.reduce((sum, t) => sum + doc.heightOfString(t, { width: this.width - 2 * pad - 10 }) + 2, 0)
    const height = bodyHeight + 2 * pad + 14
    this.ensure(height)
    const top = doc.y
    doc.rect(MARGIN.left, top, this.width, height).fillAndStroke(CAUTION_FILL, CAUTION_EDGE)
    doc.font(REPORT_FONTS.bold).fontSize(9).fillColor(CAUTION_EDGE).text('Cautions: read before using this record', MARGIN.left + pad, top + pad, { width: this.width - 2 * pad })
    doc.y += 3
    doc.font(REPORT_FONTS.sans).fontSize(8.5).fillColor(INK)
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
