// The QA audit of the decision record: filters, a search, and pages small enough to check every
// chain shown.
import { z } from 'zod'
import { AUDIT_MIN_TEXT_SEARCH, isAuditSearch } from '../utils/audit-search'
import { DECISION_STATUSES } from '../utils/decision-status'
import { projectFilterSchema } from './overview'
import { pageQuerySchema } from './pagination'

export const AUDIT_MAX_PAGE_SIZE = 50

export const auditFilterSchema = z.object({
  projectId: projectFilterSchema,
  status: z.preprocess(v => (v === '' ? undefined : v), z.enum(DECISION_STATUSES, {
    errorMap: () => ({ message: `Status must be one of: ${DECISION_STATUSES.join(', ')}.` }),
  }).optional()),
  // A decision number (#123 or 123), or words of its title or its author's name.
  q: z.preprocess(v => (typeof v === 'string' && !v.trim() ? undefined : v), z.string({ invalid_type_error: 'The search must be text.' })
    .trim().max(100, 'The search is at most 100 characters.')
    .refine(isAuditSearch, `Search for a decision number or at least ${AUDIT_MIN_TEXT_SEARCH} characters of a title or a name.`).optional()),
})
export type AuditFilter = z.infer<typeof auditFilterSchema>

export const auditListQuerySchema = auditFilterSchema.merge(pageQuerySchema(AUDIT_MAX_PAGE_SIZE, 20))
export type AuditListQuery = z.infer<typeof auditListQuerySchema>
