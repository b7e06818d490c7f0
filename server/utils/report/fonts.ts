// DejaVu fonts embedded in the PDF (a TTF that ships in an npm package; pdfkit cannot read WOFF2),
// so names and comments in any script print as typed. Subsets are embedded, so the file stays small.
import { readFileSync } from 'node:fs'
import { createRequire } from 'node:module'

export const REPORT_FONTS = {
  sans: 'ReportSans',
  bold: 'ReportSansBold',
  oblique: 'ReportSansOblique',
  mono: 'ReportMono',
} as const

const FILES: Record<keyof typeof REPORT_FONTS, string> = {
  sans: 'DejaVuSans.ttf',
  bold: 'DejaVuSans-Bold.ttf',
  oblique: 'DejaVuSans-Oblique.ttf',
  mono: 'DejaVuSansMono.ttf',
}

type FontData = Record<keyof typeof REPORT_FONTS, Buffer>
let loaded: FontData | undefined

/** The font files, read once per process (nuxt.config.ts traces them into the server build). */
function fontData(): FontData {
  if (!loaded) {
    const require = createRequire(import.meta.url)
    const read = (file: string) => readFileSync(require.resolve(`dejavu-fonts-ttf/ttf/${file}`))
    loaded = Object.fromEntries(Object.entries(FILES).map(([key, file]) => [key, read(file)])) as FontData
  }
  return loaded
}

export function registerReportFonts(doc: PDFKit.PDFDocument) {
  const data = fontData()
  for (const key of Object.keys(REPORT_FONTS) as (keyof typeof REPORT_FONTS)[]) {
    doc.registerFont(REPORT_FONTS[key], data[key])
  }
  doc.font(REPORT_FONTS.sans)
}
