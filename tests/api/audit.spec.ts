// The QA audit of the decision record: the list and the CSV agree with each decision's own
// history and /verify, and a row altered behind the application's back is flagged, alone.
import pg from 'pg'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { type ApiClient, signIn } from '../support/api-client'
import { APPROACH_LABELS, MODELS_BY_APPROACH, WALL_TREATMENTS_BY_APPROACH, WALL_TREATMENT_LABELS, type ApproachId } from '#shared/rules'
import { act, createDraft, projectIds, tamperWithEvent, uniqueTitle } from '../support/decisions'
import { allPages } from '../support/pages'

type AuditRow = {
  id: number; projectId: number; projectCode: string; title: string; status: string; revision: number
  author: { id: number; name: string }; reviewer: { id: number; name: string } | null; eventCount: number; lastEventAt: string; lastHash: string
  approach: string; model: string; wallTreatment: string; overrideReason: string | null; unitSystem: string; coreHours: number; budgetCoreHours: number
  engineVersion: string; rulesetVersion: string; createdAt: string; updatedAt: string; submittedAt: string | null; reviewedAt: string | null
  chain: { valid: boolean; checked: number; brokenAt: number | null }
}

const CSV_HEADER = [
  'project', 'decision', 'title', 'status', 'approach', 'model', 'wall treatment', 'engine recommended', 'author', 'reviewer',
  'override reason', 'created', 'submitted', 'reviewed', 'last change', 'ruleset version', 'engine version', 'revisions',
  'events', 'chain valid', 'chain broken at event', 'last hash',
  // After the run (records that stand; retracted ones counted apart).
  'wall checks', 'latest wall check in band', 'latest wall check verdict', 'latest wall check review', 'latest wall check sha256',
  'grid studies', 'latest fine-grid GCI', 'CPU runs', 'actual core-hours', 'estimated core-hours of the runs', 'retracted records',
  'unit system', 'estimated core-hours of the decision', 'core-hour budget',
]
const column = (name: string) => CSV_HEADER.indexOf(name)

// A small RFC 4180 reader, so the export is checked without the server's writer.
function parseCsv(text: string): string[][] {
  const rows: string[][] = []
  let row: string[] = []
  let field = ''
  let quoted = false
  for (let i = 0; i < text.length; i++) {
    const c = text[i]!
    if (quoted) {
      if (c === '"' && text[i + 1] === '"') { field += '"'; i++ }
      else if (c === '"') quoted = false
      else field += c
    } else if (c === '"') quoted = true
    else if (c === ',') { row.push(field); field = '' }
    else if (c === '\r' && text[i + 1] === '\n') { row.push(field); rows.push(row); row = []; field = ''; i++ }
    else field += c
  }
  if (field || row.length) { row.push(field); rows.push(row) }
  return rows
}

let auditor: ApiClient
let lead: ApiClient
let engineer: ApiClient
let reviewer: ApiClient
let project: Record<string, number>
let owner: pg.Client
let mine: { id: number }
let overridden: { id: number; [key: string]: any }
// A title that needs quoting, and one a spreadsheet would run as a formula.
const awkwardTitle = uniqueTitle('Supply duct, "north" riser')
const formulaTitle = `=1+1 ${uniqueTitle('duct')}`

async function allAuditRows(client: ApiClient, filter = ''): Promise<AuditRow[]> {
  const { rows, first } = await allPages<AuditRow>(client, `/api/audit/decisions?${filter}`)
  // The demo database is small: every total is counted exactly.
  expect(first).toMatchObject({ total: rows.length, totalIsEstimate: false })
  return rows
}

async function projectTotal(projectId: number, status = '') {
  return (await auditor.get(`/api/projects/${projectId}/decisions?limit=1${status ? `&status=${status}` : ''}`)).body.total as number
}

beforeAll(async () => {
  ;[auditor, lead, engineer, reviewer] = await Promise.all(['auditor', 'lead', 'engineer', 'reviewer'].map(signIn))
  project = await projectIds(auditor)
  owner = new pg.Client({ connectionString: inject('databaseOwnerUrl') })
  await owner.connect()
  const draft = await createDraft(engineer, project['KB-102']!, { title: awkwardTitle })
  const submitted = await act(engineer, `/api/decisions/${draft.id}/submit`, { version: draft.version })
  await act(reviewer, `/api/decisions/${draft.id}/comments`, { comment: 'Which inlet profile did you assume?' })
  await act(reviewer, `/api/decisions/${draft.id}/approve`, { version: submitted.version })
  mine = draft
  await createDraft(engineer, project['KB-101']!, { title: formulaTitle })
  // An override, so the export carries its reason.
  const other = await createDraft(engineer, project['KB-103']!, { title: uniqueTitle('Audit override') })
  const inReview = await act(engineer, `/api/decisions/${other.id}/submit`, { version: other.version })
  const approach: ApproachId = other.advice.recommendation.approach === 'urans' ? 'rans' : 'urans'
  overridden = await act(reviewer, `/api/decisions/${other.id}/override`, {
    version: inReview.version, approach, model: MODELS_BY_APPROACH[approach][0], wallTreatment: WALL_TREATMENTS_BY_APPROACH[approach][0],
    comment: 'Unsteady loads matter here, so "steady" will not do.',
  })
})

afterAll(async () => {
  await owner?.end()
})

describe('GET /api/audit/decisions', () => {
  it('lists every decision of every project, each with its history and the check /verify gives', async () => {
    const rows = await allAuditRows(auditor)
    let expectedTotal = 0
    for (const id of Object.values(project)) expectedTotal += await projectTotal(id)
    expect(rows.length).toBe(expectedTotal)
    expect(new Set(rows.map(r => r.id)).size).toBe(rows.length)
    for (const row of rows) {
      const detail = (await auditor.get(`/api/decisions/${row.id}`)).body
      expect(row.projectCode).toBe(detail.project.code)
      expect(row).toMatchObject({ title: detail.decision.title, status: detail.decision.status, revision: detail.revisions.length })
      expect(row.author.name).toBe(detail.decision.author.name)
      expect(row.eventCount).toBe(detail.events.length)
      expect(row.lastHash).toBe(detail.events.at(-1).hash)
      expect(row.lastEventAt).toBe(detail.events.at(-1).createdAt)
      expect(row.chain, `decision ${row.id}`).toEqual((await auditor.get(`/api/decisions/${row.id}/verify`)).body)
    }
    const own = rows.find(r => r.id === mine.id)!
    expect(own).toMatchObject({
      projectCode: 'KB-102', title: awkwardTitle, status: 'approved', eventCount: 4, chain: { valid: true, checked: 4, brokenAt: null, problems: [] },
      reviewer: { name: 'Priya Raman' }, overrideReason: null,
    })
    expect(Date.parse(own.reviewedAt!)).toBeGreaterThan(Date.parse(own.submittedAt!))
    // Latest activity first.
    const times = rows.map(r => Date.parse(r.updatedAt))
    expect(times).toEqual([...times].sort((a, b) => b - a))
    // The lead reads the same list.
    expect((await lead.get('/api/audit/decisions?limit=50')).body.items).toEqual(rows.slice(0, 50))
  })

  it('filters by project and status, and pages', async () => {
    const kb102 = await allAuditRows(auditor, `&projectId=${project['KB-102']}`)
    expect(kb102.length).toBe(await projectTotal(project['KB-102']!))
    expect(kb102.every(r => r.projectCode === 'KB-102')).toBe(true)
    const drafts = await allAuditRows(auditor, '&status=draft')
    let draftTotal = 0
    for (const id of Object.values(project)) draftTotal += await projectTotal(id, 'draft')
    expect(drafts.length).toBe(draftTotal)
    expect(drafts.every(r => r.status === 'draft')).toBe(true)
    // Pages follow on from the cursor, without overlap, whatever the page size.
    const first = (await auditor.get('/api/audit/decisions?limit=2')).body
    const second = (await auditor.get(`/api/audit/decisions?limit=2&cursor=${first.nextCursor}`)).body
    expect(first.items).toHaveLength(2)
    expect(second.items.map((r: AuditRow) => r.id)).toEqual((await allAuditRows(auditor)).slice(2, 4).map(r => r.id))
    expect(second.total).toBe(first.total)
  })

  it('searches by decision number, title and author', async () => {
    const byNumber = await allAuditRows(auditor, `q=%23${mine.id}`)
    expect(byNumber.map(r => r.id)).toContain(mine.id)
    expect(byNumber.every(r => r.id === mine.id || r.title.includes(String(mine.id)))).toBe(true)
    const byTitle = await allAuditRows(auditor, `q=${encodeURIComponent('"north" RISER')}`)
    expect(byTitle.map(r => r.id)).toEqual([mine.id])
    const byAuthor = await allAuditRows(auditor, 'q=lindqvist')
    expect(byAuthor.length).toBeGreaterThan(0)
    expect(byAuthor.every(r => r.author.name === 'Tomas Lindqvist')).toBe(true)
    // A title naming the author too: found once, and counted once (allAuditRows checks the total).
    const named = await createDraft(engineer, project['KB-101']!, { title: uniqueTitle('Riser as Lindqvist sketched it') })
    const byEither = await allAuditRows(auditor, 'q=lindqvist')
    expect(byEither.map(r => r.id).sort()).toEqual([...byAuthor.map(r => r.id), named.id].sort())
    // LIKE's wildcards are searched for as typed.
    expect(await allAuditRows(auditor, 'q=%25%25%25')).toEqual([])
    // The search narrows the filters, it does not replace them.
    expect(await allAuditRows(auditor, `q=%23${mine.id}&status=draft`)).toEqual([])
    // A one-digit decision number is a search of its own (the seed's first decisions have one).
    const first = (await allAuditRows(auditor)).map(r => r.id).sort((a, b) => a - b)[0]!
    expect(first).toBeLessThan(10)
    expect((await allAuditRows(auditor, `q=${first}`)).map(r => r.id)).toContain(first)
  })
  it.each(['engineer', 'reviewer', 'admin'])('refuses %s with 403, the list and the CSV', async (role) => {
    const client = await signIn(role)
    for (const path of ['/api/audit/decisions', '/api/audit/decisions.csv']) {
      const res = await client.get(path)
      expect(res.status, path).toBe(403)
      expect(res.body.message).toMatch(/auditor or lead/)
    }
  })

  it.each([
    ['limit=1000', /limit is at most 50/],
    ['limit=0', /limit is at least 1/],
    ['cursor=not-a-cursor', /cursor is not one this server gave/],
    ['q=' + 'x'.repeat(101), /search is at most 100 characters/],
    // Two letters would match every title through the trigram index's shortest word: refused, said why.
    ['q=ab', /decision number or at least 3 characters/],
    ['status=signed', /Status must be one of/],
    ['projectId=x', /project must be given by its id/],
  ])('answers 400 with a message for %s', async (query, message) => {
    const res = await auditor.get(`/api/audit/decisions?${query}`)
    expect(res.status).toBe(400)
    expect(res.body.message).toMatch(message)
  })

  it('answers 404 for a project that does not exist', async () => {
    expect((await auditor.get('/api/audit/decisions?projectId=999999')).status).toBe(404)
    expect((await auditor.get('/api/audit/decisions.csv?projectId=999999')).status).toBe(404)
  })
})

describe('GET /api/audit/decisions.csv', () => {
  it('exports every row with the columns of the audit, quoted where needed, as a dated file', async () => {
    const res = await auditor.request('GET', '/api/audit/decisions.csv', undefined, { accept: 'text/csv' })
    expect(res.status).toBe(200)
    expect(res.headers.get('content-type')).toMatch(/^text\/csv/)
    expect(res.headers.get('content-disposition')).toBe(`attachment; filename="eddyledger-audit-${new Date().toISOString().slice(0, 10)}.csv"`)
    // A UTF-8 byte-order mark first, so spreadsheets read the names right (fetch's text() drops it).
    const raw = await fetch(auditor.baseUrl + '/api/audit/decisions.csv', { headers: { cookie: auditor.cookie, 'x-forwarded-for': auditor.address } })
    expect([...new Uint8Array(await raw.arrayBuffer()).slice(0, 3)]).toEqual([0xEF, 0xBB, 0xBF])
    const [header, ...lines] = parseCsv(res.body as string)
    expect(header).toEqual(CSV_HEADER)
    const rows = await allAuditRows(auditor)
    expect(lines.map(l => Number(l[column('decision')]))).toEqual(rows.map(r => r.id))
    for (const [i, line] of lines.entries()) {
      const r = rows[i]!
      expect(line).toHaveLength(CSV_HEADER.length)
      expect(line[column('project')]).toBe(r.projectCode)
      expect(line[column('approach')]).toBe(APPROACH_LABELS[r.approach as ApproachId])
      expect(line[column('model')]).toBe(r.model)
      expect(line[column('created')]).toBe(r.createdAt)
      expect(line[column('last change')]).toBe(r.updatedAt)
      expect(line[column('revisions')]).toBe(String(r.revision))
      expect(line[column('events')]).toBe(String(r.eventCount))
      expect(line[column('chain valid')]).toBe(r.chain.valid ? 'yes' : 'no')
      expect(line[column('last hash')]).toBe(r.lastHash)
      expect(line[column('engine version')]).toBe(r.engineVersion)
      expect(line[column('ruleset version')]).toBe(r.rulesetVersion)
      // Numbers a spreadsheet reads: plain digits, the estimate to two significant figures.
      expect(line[column('unit system')]).toBe(r.unitSystem)
      expect(Number(line[column('estimated core-hours of the decision')])).toBe(Number(r.coreHours.toPrecision(2)))
      expect(line[column('estimated core-hours of the decision')]).toMatch(/^[\d.e+-]+$/)
      expect(Number(line[column('core-hour budget')])).toBe(r.budgetCoreHours)
    }
    const own = lines.find(l => Number(l[column('decision')]) === mine.id)!
    expect([own[0], own[2], own[3], own[8], own[9], own[10], own[17], own[18], own[19], own[20]])
      .toEqual(['KB-102', awkwardTitle, 'Approved', 'Ada Ferreira', 'Priya Raman', '', '1', '4', 'yes', ''])
    const row = rows.find(r => r.id === mine.id)!
    expect(own[column('submitted')]).toBe(row.submittedAt)
    expect(own[column('reviewed')]).toBe(row.reviewedAt)
    // The override: the reviewer's approach, model and wall treatment, the engine's and the reason.
    const over = lines.find(l => Number(l[column('decision')]) === overridden.id)!
    const choice = overridden.override
    expect(over[column('approach')]).toBe(APPROACH_LABELS[choice.approach as ApproachId])
    expect(over[column('wall treatment')]).toBe(WALL_TREATMENT_LABELS[choice.wallTreatment as keyof typeof WALL_TREATMENT_LABELS])
    expect(over[column('engine recommended')]).toBe(APPROACH_LABELS[overridden.advice.recommendation.approach as ApproachId])
    expect(over[column('override reason')]).toBe('Unsteady loads matter here, so "steady" will not do.')
    // Formula text is defused for spreadsheets: an apostrophe before it.
    expect(lines.some(l => l[column('title')] === `'${formulaTitle}`)).toBe(true)
  })

  it('exports what the filters and the search select', async () => {
    const csv = parseCsv((await auditor.get(`/api/audit/decisions.csv?projectId=${project['KB-102']}&status=approved`)).body as string)
    const expected = await allAuditRows(auditor, `projectId=${project['KB-102']}&status=approved`)
    expect(csv.slice(1).map(l => Number(l[column('decision')]))).toEqual(expected.map(r => r.id))
    const searched = parseCsv((await auditor.get(`/api/audit/decisions.csv?q=%23${mine.id}`)).body as string)
    expect(searched.slice(1).map(l => Number(l[column('decision')]))).toContain(mine.id)
  })
})

describe('tampering', () => {
  it('flags exactly the altered decision, in the list and in the CSV', async () => {
    const before = await allAuditRows(auditor)
    // Other test files may have left an altered decision of their own; only the change counts here.
    const brokenBefore = new Set(before.filter(r => !r.chain.valid).map(r => r.id))
    expect(brokenBefore.has(mine.id)).toBe(false)
    const tamperedId = await tamperWithEvent(owner, mine.id, 3, { comment: 'Looks fine.' })

    const after = await allAuditRows(auditor)
    const brokenAfter = after.filter(r => !r.chain.valid)
    expect(brokenAfter.map(r => r.id).sort()).toEqual([...brokenBefore, mine.id].sort())
    expect(after.find(r => r.id === mine.id)!.chain).toEqual({ valid: false, checked: 3, brokenAt: tamperedId, problems: [] })

    const csv = parseCsv((await auditor.get('/api/audit/decisions.csv')).body as string)
    const own = csv.find(l => Number(l[column('decision')]) === mine.id)!
    expect([own[column('chain valid')], own[column('chain broken at event')]]).toEqual(['no', String(tamperedId)])
    expect(csv.slice(1).filter(l => l[column('chain valid')] === 'no').map(l => Number(l[column('decision')])).sort())
      .toEqual(brokenAfter.map(r => r.id).sort())
  })
})
