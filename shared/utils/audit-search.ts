// What the audit's search box accepts: a decision number, or enough text to match words of a title
// or a name. Shared by the query schema and the page, which holds back a search too short to run.

/** Words of a title or a name are searched from 3 characters (the trigram indexes' shortest). */
export const AUDIT_MIN_TEXT_SEARCH = 3
/** A decision number as typed in the search: 123 or #123. */
export const DECISION_NUMBER_SEARCH = /^#?(\d{1,9})$/
/** Whether a search is one the audit runs: a decision number, or enough text to match words. */
export const isAuditSearch = (q: string) => DECISION_NUMBER_SEARCH.test(q) || q.length >= AUDIT_MIN_TEXT_SEARCH
