// A decision's statuses: one list for the database enum (server/db/schema.ts), the routes' schemas
// and the pages. No engine import, so pages that only list decisions stay light.
export const DECISION_STATUSES = ['draft', 'in_review', 'approved', 'overridden', 'superseded'] as const
export type DecisionStatus = (typeof DECISION_STATUSES)[number]

export const DECISION_STATUS_LABELS: Record<DecisionStatus, string> = {
  draft: 'Draft',
  in_review: 'In review',
  approved: 'Approved',
  overridden: 'Overridden',
  superseded: 'Superseded',
}
