// The decision's PDF record through the real server and PostgreSQL: who may download it, what it
// is called, and what it says, read back with poppler's pdftotext (installed by scripts/test.sh).
import { execFileSync } from 'node:child_process'
import { mkdirSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { beforeAll, describe, expect, it } from 'vitest'
import { formatDistance } from '#shared/format/case-rows'
import { formatInput } from '#shared/utils/format'
import { APPROACH_LABELS, GENERAL_CAUTIONS, type ApproachId } from '#shared/rules'
import { ApiClient, signIn } from '../support/api-client'
import { projectIds } from '../support/decisions'
import { allPages } from '../support/pages'

type Detail = {
  decision: { id: number; title: string; status: string; version: number; advice: any; override: any; entered: any; unitSystem: 'si' | 'imperial'; caseInput: any }
  project: { code: string }
  events: { type: string; hash: string; payload: any }[]
}

const SEEDED = {
  approved: { code: 'KB-101', title: 'Ferry hull calm-water resistance at service speed' },
  overridden: { code: 'KB-103', title: 'Condenser wake and tonal noise at the east facade' },
  inReview: { code: 'KB-102', title: 'Supply duct pressure drop and wall heat transfer' },
  draft: { code: 'KB-104', title: 'Intake bay swirl at the pump bell mouth' },
} as const

const KEYS = ['engineer', 'engineer2', 'auditor', 'lead', 'admin'] as const
const c = {} as Record<(typeof KEYS)[number], ApiClient>
const ids = {} as Record<keyof typeof SEEDED, number>
const workDir = mkdtempSync(join(tmpdir(), 'eddyledger-report-'))

async function download(client: ApiClient | null, path: string) {
  const res = await fetch((client?.baseUrl ?? new ApiClient().baseUrl) + path, {
    headers: client ? { cookie: client.cookie, 'x-forwarded-for': client.address } : {},
  })
  return { status: res.status, headers: res.headers, bytes: Buffer.from(await res.arrayBuffer()) }
}

const reportPath = (id: number | string) => `/api/decisions/${id}/report.pdf`

let fileCounter = 0
function pdfToText(bytes: Buffer) {
  const file = join(workDir, `report-${++fileCounter}.pdf`)
  writeFileSync(file, bytes)
  return execFileSync('/usr/bin/pdftotext', ['-layout', file, '-'], { encoding: 'utf8' })
}
// pdftotext breaks lines where the PDF wraps them: compare without whitespace.
const squeeze = (text: string) => text.replace(/\s+/g, '')
const expectWords = (text: string, words: string) => expect(squeeze(text), words).toContain(squeeze(words))

beforeAll(async () => {
  for (const key of KEYS) c[key] = await signIn(key)
  const projects = await projectIds(c.auditor)
  for (const [name, seeded] of Object.entries(SEEDED) as [keyof typeof SEEDED, (typeof SEEDED)[keyof typeof SEEDED]][]) {
    // Other files add decisions to the demo projects: read every page, take the seeded (oldest) one.
    const { rows: found } = await allPages<{ id: number; title: string }>(c.auditor, `/api/projects/${projects[seeded.code]}/decisions`, 100)
    const match = found.filter(d => d.title === seeded.title).sort((a, b) => a.id - b.id)[0]
    expect(match, seeded.title).toBeDefined()
    ids[name] = match!.id
  }
})

describe('GET /api/decisions/:id/report.pdf', () => {
  it('answers a PDF attachment named after the project, the decision and its version', async () => {
    const detail = (await c.engineer.get(`/api/decisions/${ids.overridden}`)).body as Detail
    const res = await download(c.engineer, reportPath(ids.overridden))
    expect(res.status).toBe(200)
    expect(res.headers.get('content-type')).toBe('application/pdf')
    expect(res.bytes.subarray(0, 5).toString('latin1')).toBe('%PDF-')
    expect(res.headers.get('content-disposition')).toBe(
      `attachment; filename="eddyledger-KB-103-decision-${detail.decision.id}-v${detail.decision.version}.pdf"`,
    )
  })

  it('records an overridden decision: both choices, the reason, the rules disagreed with, the recomputed wall, the cautions and the verified history', async () => {
    const detail = (await c.engineer.get(`/api/decisions/${ids.overridden}`)).body as Detail
    const { decision } = detail
    expect(decision.override).not.toBeNull()
    const text = pdfToText((await download(c.engineer, reportPath(ids.overridden))).bytes)

    expectWords(text, decision.title)
    expectWords(text, `Project KB-103`)
    expectWords(text, APPROACH_LABELS[decision.advice.recommendation.approach as ApproachId])
    expectWords(text, APPROACH_LABELS[decision.override.approach as ApproachId])
    expectWords(text, decision.override.model)
    expectWords(text, decision.override.comment)
    for (const rule of decision.override.disagreedRules as string[]) expectWords(text, rule)
    // The near-wall figures are the stored override's, recomputed for its wall treatment (same
    // numbers as GET /api/decisions/:id; the physics is checked in tests/unit/shared/rules).
    expectWords(text, "Near-wall mesh for the reviewer's choice (recomputed)")
    expectWords(text, formatDistance(decision.override.wall.firstCellHeight, decision.unitSystem))
    // Each column costed for its own choice: the reviewer's core-hours beside the engine's.
    expectWords(text, 'Core-hours')
    for (const caution of GENERAL_CAUTIONS) expectWords(text, caution)
    for (const caution of decision.advice.cautions as string[]) expectWords(text, caution)
    // The engineer's inputs stand as typed, in their units, not rounded to three figures (1,024 cores, 101.325 kPa).
    expectWords(text, `Case input as typed (${decision.unitSystem === 'si' ? 'SI' : 'imperial'} units)`)
    expectWords(text, `Cores ${formatInput(decision.caseInput.budget.cores)}`)
    expect(decision.caseInput.budget.cores % 10).not.toBe(0)
    expectWords(text, `Static pressure ${formatInput(decision.entered.fluid.pressure.value)} kPa`)

    for (const event of detail.events) {
      expect(text).toContain(event.type)
      expect(text).toContain(event.hash.slice(0, 16))
    }
    const verify = (await c.engineer.get(`/api/decisions/${ids.overridden}/verify`)).body
    expect(verify.valid).toBe(true)
    expectWords(text, `Chain intact: ${verify.checked} events recomputed`)
    expect(text).toContain(detail.events.at(-1)!.hash)
    expect(text).toMatch(/page 1 of (\d+)/)
    const pages = Number(/page 1 of (\d+)/.exec(text)![1])
    expect(text).toContain(`page ${pages} of ${pages}`)
    // The short caution in every page's footer.
    expect(squeeze(text).match(/Order-of-magnitudeestimatesforplanning;verifyy\+/g)?.length).toBe(pages)
  })

  it('records an approved decision for an auditor and a lead, with the engine recommendation and the approval', async () => {
    const detail = (await c.auditor.get(`/api/decisions/${ids.approved}`)).body as Detail
    for (const reader of [c.auditor, c.lead]) {
      const res = await download(reader, reportPath(ids.approved))
      expect(res.status).toBe(200)
      const text = pdfToText(res.bytes)
      expectWords(text, detail.decision.title)
      expectWords(text, APPROACH_LABELS[detail.decision.advice.recommendation.approach as ApproachId])
      expectWords(text, 'Approved')
      expectWords(text, detail.events.find(e => e.type === 'approved')!.payload.comment)
      for (const event of detail.events) expect(text).toContain(event.type)
      expect(text).not.toContain("Reviewer's choice")
    }
  })

  it('records a decision in review and a draft for their project members', async () => {
    for (const [name, reader, status] of [['inReview', c.engineer2, 'In review'], ['draft', c.engineer2, 'Draft']] as const) {
      const res = await download(reader, reportPath(ids[name]))
      expect(res.status, name).toBe(200)
      const text = pdfToText(res.bytes)
      expectWords(text, SEEDED[name].title)
      expectWords(text, `Status ${status}`)
      expect(text).toContain('Chain intact')
    }
  })

  it('is the same record on a second download, apart from the generation time', async () => {
    const strip = (text: string) => text.replace(/Generated at.*$/m, '')
    const [a, b] = await Promise.all([download(c.auditor, reportPath(ids.approved)), download(c.auditor, reportPath(ids.approved))])
    expect(strip(pdfToText(a.bytes))).toBe(strip(pdfToText(b.bytes)))
  })

  it('is refused to whoever may not read the decision, as the decision itself is', async () => {
    const cases: [ApiClient, number][] = [
      [c.engineer2, ids.approved], // KB-101: not a member
      [c.engineer, ids.draft], // KB-104: not a member
      [c.admin, ids.overridden], // administrators are not given decision contents
    ]
    for (const [client, id] of cases) {
      const decision = await client.get(`/api/decisions/${id}`)
      const report = await download(client, reportPath(id))
      expect(decision.status).toBe(403)
      expect(report.status).toBe(403)
      expect(JSON.parse(report.bytes.toString('utf8')).message).toBe(decision.body.message)
    }
    expect((await download(null, reportPath(ids.approved))).status).toBe(401)
  })

  it('answers 404 for a decision that does not exist and 400 for an id that is not one', async () => {
    const missing = await download(c.auditor, reportPath(987654321))
    expect(missing.status).toBe(404)
    expect(JSON.parse(missing.bytes.toString('utf8')).message).toMatch(/does not exist/)
    for (const bad of ['abc', '0', '-3', '1.5']) {
      const res = await download(c.auditor, reportPath(bad))
      expect(res.status, bad).toBe(400)
      expect(JSON.parse(res.bytes.toString('utf8')).message).toMatch(/id/i)
    }
  })

  it('renders its first page as an image for review (tests/artifacts/decision-report-page1.png)', async () => {
    const file = join(workDir, 'overridden.pdf')
    writeFileSync(file, (await download(c.engineer, reportPath(ids.overridden))).bytes)
    const artifacts = new URL('../artifacts/', import.meta.url).pathname
    mkdirSync(artifacts, { recursive: true })
    execFileSync('/usr/bin/pdftoppm', ['-png', '-r', '110', '-f', '1', '-l', '1', '-singlefile', file, join(artifacts, 'decision-report-page1')])
    const png = readFileSync(join(artifacts, 'decision-report-page1.png'))
    expect(png.subarray(1, 4).toString('latin1')).toBe('PNG')
    // A4 (595 x 842 pt) at 110 dpi: about 909 x 1286 pixels (width and height in the IHDR chunk).
    expect(Math.abs(png.readUInt32BE(16) - 909)).toBeLessThanOrEqual(2)
    expect(Math.abs(png.readUInt32BE(20) - 1286)).toBeLessThanOrEqual(2)
  })
})
