import type { Role } from '#shared/utils/roles'

export type NavItem = { to: string; label: string }

// What each role's header offers. The server refuses the rest whatever the menu shows.
const NAV: Record<Role, NavItem[]> = {
  engineer: [{ to: '/projects', label: 'Projects' }],
  reviewer: [{ to: '/review', label: 'Review queue' }, { to: '/projects', label: 'Projects' }],
  auditor: [{ to: '/audit', label: 'Audit' }, { to: '/ledger', label: 'Ledger' }, { to: '/overview', label: 'Overview' }, { to: '/projects', label: 'Projects' }],
  lead: [
    { to: '/overview', label: 'Overview' }, { to: '/audit', label: 'Audit' }, { to: '/ledger', label: 'Ledger' }, { to: '/calibration', label: 'Calibration' },
    { to: '/projects', label: 'Projects' }, { to: '/rulesets', label: 'Rulesets' },
  ],
  admin: [
    { to: '/projects', label: 'Projects' },
    { to: '/admin/users', label: 'Users' },
    { to: '/admin/projects', label: 'Manage projects' },
    { to: '/admin/mail', label: 'Mail' },
    { to: '/rulesets', label: 'Rulesets' },
    { to: '/ledger', label: 'Ledger' },
  ],
}

// Every role reads the guidance articles.
const GUIDANCE_ITEM: NavItem = { to: '/guidance', label: 'Guidance' }

export function navFor(role: Role | undefined): NavItem[] {
  return role ? [...NAV[role], GUIDANCE_ITEM] : []
}

// Where each role starts: the work waiting for it (the reviewer's queue, the auditor's list, the
// lead's overview); engineers and administrators start from the projects.
const LANDING: Record<Role, string> = {
  engineer: '/projects',
  reviewer: '/review',
  auditor: '/audit',
  lead: '/overview',
  admin: '/projects',
}

export function landingFor(role: Role | undefined): string {
  return role ? LANDING[role] : '/login'
}
