// Roles and the words the UI uses for them. Imported relatively by server/db/schema.ts too.
export const ROLES = ['engineer', 'reviewer', 'auditor', 'lead', 'admin'] as const
export type Role = (typeof ROLES)[number]

export const ROLE_LABELS: Record<Role, string> = {
  engineer: 'Engineer',
  reviewer: 'Senior reviewer',
  auditor: 'QA auditor',
  lead: 'Team lead',
  admin: 'Administrator',
}

// Roles that read every project without being members of it.
export const READS_ALL_PROJECTS: readonly Role[] = ['auditor', 'lead', 'admin']
// Roles that work inside projects they are members of.
export const MEMBER_ROLES: readonly Role[] = ['engineer', 'reviewer']
