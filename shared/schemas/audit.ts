// The QA audit of the decision record: filters, and pages small enough to check every chain shown.
import { z } from 'zod'
import { DECISION_STATUSES } from '../utils/decision-status'
import { projectFilterSchema } from './overview'
import { INT32_MAX } from './common'

export const AUDIT_MAX_PAGE_SIZE = 50

export const auditFilterSchema = z.object({
  projectId: projectFilterSchema,
  status: z.preprocess(v => (v === '' ? undefined : v), z.enum(DECISION_STATUSES, {
    errorMap: () => ({ message: `Status must be one of: ${DECISION_STATUSES.join(', ')}.` }),
  }).optional()),
})
export type AuditFilter = z.infer<typeof auditFilterSchema>

export const auditListQuerySchema = auditFilterSchema.extend({
  page: z.coerce.number({ invalid_type_error: 'Page must be a number.' }).int('Page must be a whole number.')
    .min(1, 'Page starts at 1.').max(INT32_MAX, `Page is at most ${INT32_MAX}.`).default(1),
  pageSize: z.coerce.number({ invalid_type_error: 'Page size must be a number.' }).int('Page size must be a whole number.')
    .min(1, 'Page size is at least 1.').max(AUDIT_MAX_PAGE_SIZE, `Page size is at most ${AUDIT_MAX_PAGE_SIZE}, so every chain on the page can be checked.`).default(20),
})
export type AuditListQuery = z.infer<typeof auditListQuerySchema>
