// The QA audit of the decision record: the list and the CSV agree with each decision's own
// history and /verify, and a row altered behind the application's back is flagged, alone.
import pg from 'pg'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { type ApiClient, signIn } from '../support/api-client'
import { act, createDraft, projectIds, tamperWithEvent, uniqueTitle } from '../support/decisions'

type AuditRow = {
  id: number; projectId: number; projectCode: string; title: string; status: string; revision: number
  author: { id: number; name: string }; eventCount: number; lastEventAt: string; lastHash: string
  engineVersion: string; rulesetVersion: string; approach: string; unitSystem: string; coreHours: number; budgetCoreHours: number
  chain: { valid: boolean; checked: number; brokenAt: number | null }
}

const CSV_HEADER = [
  'decision id', 'project', 'title', 'status', 'author', 'revisions', 'events', 'chain valid', 'chain broken at event',
  'last hash', 'engine version', 'ruleset version',
  'wall checks', 'latest wall check in band', 'latest wall check verdict', 'latest wall check review', 'latest wall check sha256',
  'grid studies', 'latest fine-grid GCI', 'CPU runs', 'actual core-hours', 'estimated core-hours of the runs', 'retracted records',
  'approach', 'unit system', 'estimated core-hours of the decision', 'core-hour budget',
]

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
// A title that needs quoting, and one a spreadsheet would run as a formula.
const awkwardTitle = uniqueTitle('Supply duct, "north" riser')
const formulaTitle = `=1+1 ${uniqueTitle('duct')}`

async function allAuditRows(client: ApiClient, filter = ''): Promise<AuditRow[]> {
  const rows: AuditRow[] = []
  for (let page = 1; ; page++) {
    const res = await client.get(`/api/audit/decisions?pageSize=50&page=${page}${filter}`)
    expect(res.status, JSON.stringify(res.body)).toBe(200)
    rows.push(...res.body.decisions)
    if (page * 50 >= res.body.total) return rows
  }
}

async function projectTotal(projectId: number, status = '') {
  return (await auditor.get(`/api/projects/${projectId}/decisions?pageSize=1${status ? `&status=${status}` : ''}`)).body.total as number
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
    expect(own).toMatchObject({ projectCode: 'KB-102', title: awkwardTitle, status: 'approved', eventCount: 4, chain: { valid: true, checked: 4, brokenAt: null, problems: [] } })
    // The lead reads the same list.
    expect((await lead.get('/api/audit/decisions?pageSize=50')).body.decisions).toEqual(rows.slice(0, 50))
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
    const first = (await auditor.get('/api/audit/decisions?pageSize=2&page=1')).body
    const second = (await auditor.get('/api/audit/decisions?pageSize=2&page=2')).body
    expect(first.decisions).toHaveLength(2)
    expect(second.decisions[0].id).not.toBe(first.decisions[1].id)
    expect(second.total).toBe(first.total)
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
    ['pageSize=1000', /Page size is at most 50/],
    ['page=0', /Page starts at 1/],
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
    expect(lines.map(l => Number(l[0]))).toEqual(rows.map(r => r.id))
    for (const [i, line] of lines.entries()) {
      const r = rows[i]!
      expect(line).toHaveLength(CSV_HEADER.length)
      expect(line[1]).toBe(r.projectCode)
      expect(line[5]).toBe(String(r.revision))
      expect(line[6]).toBe(String(r.eventCount))
      expect(line[7]).toBe(r.chain.valid ? 'yes' : 'no')
      expect(line[9]).toBe(r.lastHash)
      expect(line[10]).toBe(r.engineVersion)
      // Numbers a spreadsheet reads: plain digits, the estimate to two significant figures.
      const at = CSV_HEADER.indexOf('approach')
      expect(line[at]).toBe(r.approach)
      expect(line[at + 1]).toBe(r.unitSystem)
      expect(Number(line[at + 2])).toBe(Number(r.coreHours.toPrecision(2)))
      expect(line[at + 2]).toMatch(/^[\d.e+-]+$/)
      expect(Number(line[at + 3])).toBe(r.budgetCoreHours)
    }
    const own = lines.find(l => Number(l[0]) === mine.id)!
    expect(own.slice(1, 9)).toEqual(['KB-102', awkwardTitle, 'Approved', 'Ada Ferreira', '1', '4', 'yes', ''])
    // Formula text is defused for spreadsheets: an apostrophe before it.
    expect(lines.some(l => l[2] === `'${formulaTitle}`)).toBe(true)
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
    const own = csv.find(l => Number(l[0]) === mine.id)!
    expect(own.slice(7, 9)).toEqual(['no', String(tamperedId)])
    expect(csv.slice(1).filter(l => l[7] === 'no').map(l => Number(l[0])).sort()).toEqual(brokenAfter.map(r => r.id).sort())
  })
})
