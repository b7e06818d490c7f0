// A ruleset version's life: a draft a lead edits, the one published version that advises, and
// the retired versions that saved decisions still name. Imported relatively by server/db/schema.ts.
export const RULESET_STATUSES = ['draft', 'published', 'retired'] as const
export type RulesetStatus = (typeof RULESET_STATUSES)[number]

export const RULESET_STATUS_LABELS: Record<RulesetStatus, string> = {
  draft: 'Draft',
  published: 'Published',
  retired: 'Retired',
}

// Who drafts, edits and publishes rulesets; every signed-in role reads the published and retired ones.
export const RULESET_EDITORS = ['lead', 'admin'] as const
