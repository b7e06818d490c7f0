// The ledger's verification report, receipts and checkpoint pages, shared by the auditor's page and
// the routes. Relative imports only (server/db/ledger-verify.ts uses it under plain Node too).
import { z } from 'zod'

export const PROBLEM_KINDS = ['altered', 'broken-link', 'rewritten', 'gap', 'state'] as const
export type LedgerProblemKind = (typeof PROBLEM_KINDS)[number]
export type LedgerProblem = { kind: LedgerProblemKind; decisionId?: number; seq?: number; detail: string }

export const PROBLEM_KIND_LABELS: Record<LedgerProblemKind, string> = {
  'altered': 'Altered entries',
  'broken-link': 'Broken links',
  'rewritten': 'Rewritten history',
  'gap': 'Missing entries or decisions',
  'state': 'State that disagrees with the events',
}

export const PROBLEM_KIND_HINTS: Record<LedgerProblemKind, string> = {
  'altered': 'An entry or the record it holds no longer hashes to what was recorded, or a row was added outside the ledger.',
  'broken-link': 'An entry does not chain onto the one before it.',
  'rewritten': 'A signed checkpoint no longer matches: the history was recomputed after it was signed.',
  'gap': 'Entries, events, checkpoints or whole decisions are missing.',
  'state': 'A decision\'s status, override, title or revision differs from what its events give.',
}

export const RECEIPT_MAX_LENGTH = 5000

export const receiptCheckSchema = z.object({
  receipt: z.string({ required_error: 'Paste or upload a receipt', invalid_type_error: 'The receipt must be text' })
    .trim().min(1, 'Paste or upload a receipt')
    .max(RECEIPT_MAX_LENGTH, 'A receipt is a few hundred characters; this text is far longer'),
})
export type ReceiptCheckBody = z.infer<typeof receiptCheckSchema>

export const CHECKPOINT_MAX_PAGE_SIZE = 100

export const checkpointListQuerySchema = z.object({
  page: z.coerce.number({ invalid_type_error: 'Page must be a number.' }).int('Page must be a whole number.')
    .min(1, 'Page starts at 1.').default(1),
  pageSize: z.coerce.number({ invalid_type_error: 'Page size must be a number.' }).int('Page size must be a whole number.')
    .min(1, 'Page size is at least 1.').max(CHECKPOINT_MAX_PAGE_SIZE, `Page size is at most ${CHECKPOINT_MAX_PAGE_SIZE}.`).default(20),
})
export type CheckpointListQuery = z.infer<typeof checkpointListQuerySchema>

export const checkpointParamSchema = z.object({
  number: z.coerce.number({ invalid_type_error: 'The checkpoint number must be a number' }).int('The checkpoint number must be a whole number')
    .positive('The checkpoint number must be a positive whole number'),
})
