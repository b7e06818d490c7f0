// Types of what the server's routes return, as the browser receives them (dates as strings), taken
// from the routes themselves: a page or component never writes a copy of a response's shape.
import type { InternalApi } from 'nitropack/types'

export type ApiResponse<Route extends keyof InternalApi, Method extends keyof InternalApi[Route] = 'get' & keyof InternalApi[Route]> =
  InternalApi[Route][Method]

export type AuditRow = ApiResponse<'/api/audit/decisions'>['items'][number]
export type ChainCheck = ApiResponse<'/api/decisions/:id/verify'>
export type TimelineEvent = ApiResponse<'/api/decisions/:id/events'>['events'][number]
export type OverviewProjectRow = ApiResponse<'/api/overview'>['compute']['projects'][number]
export type VerificationView = ApiResponse<'/api/decisions/:id/verification'>
export type WallCheckView = VerificationView['wallChecks'][number]
export type GridStudyView = VerificationView['gridStudies'][number]
export type RunView = VerificationView['runs'][number]
export type DecisionDetail = ApiResponse<'/api/decisions/:id'>
export type DecisionView = DecisionDetail['decision']
export type DecisionPermissions = DecisionDetail['permissions']
export type RevisionView = ApiResponse<'/api/decisions/:id/revisions/:n'>['revision']
export type RulesetView = ApiResponse<'/api/rulesets/:id'>['ruleset']
export type RulesetCaseView = ApiResponse<'/api/rulesets/:id/cases'>['cases'][number]
export type ImpactJobView = ApiResponse<'/api/rulesets/impact-jobs/:jobId'>['job']
export type RulesetHistoryEvent = ApiResponse<'/api/rulesets/history'>['events'][number]
