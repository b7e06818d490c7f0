import { describe, expect, it } from 'vitest'
import {
  decisionListQuerySchema,
  overrideFormSchema,
  overrideSchema,
  requestChangesSchema,
} from '#shared/schemas/decisions'

const messages = (result: { success: boolean; error?: { issues: { path: (string | number)[]; message: string }[] } }) =>
  Object.fromEntries((result.error?.issues ?? []).map(i => [i.path.join('.'), i.message]))

describe('decision payloads', () => {
  it('reads list queries from strings, with defaults', () => {
    expect(decisionListQuerySchema.parse({})).toEqual({ limit: 20 })
    expect(decisionListQuerySchema.parse({ limit: '5', status: 'approved', cursor: '' })).toEqual({ limit: 5, status: 'approved' })
  })

  it('accepts an override whose model and wall treatment belong to the approach', () => {
    const body = { version: 3, approach: 'hybrid', model: 'DDES', wallTreatment: 'wall-function', comment: 'The wake matters, not the casing layer.' }
    expect(overrideSchema.parse(body)).toEqual({ ...body, disagreedRules: [] })
  })

  it('refuses a model or wall treatment of another approach, and a comment shorter than a sentence', () => {
    const result = overrideFormSchema.safeParse({ approach: 'wmles', model: 'k-omega SST', wallTreatment: 'wall-function', comment: 'no' })
    const errors = messages(result)
    expect(Object.keys(errors).sort()).toEqual(['comment', 'model', 'wallTreatment'])
    expect(errors.model).toMatch(/WALE/)
    expect(errors.comment).toMatch(/at least a sentence/)
  })

  it('needs the version the client saw on every action', () => {
    const errors = messages(requestChangesSchema.safeParse({ comment: 'Check the inlet profile against the survey.' }))
    expect(errors.version).toMatch(/version you last saw/i)
  })
})
