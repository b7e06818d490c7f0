import type { Role } from '#shared/utils/roles'

export type NavItem = { to: string; label: string }

// What each role's header offers. The server refuses the rest whatever the menu shows.
const NAV: Record<Role, NavItem[]> = {
  engineer: [{ to: '/projects', label: 'Projects' }],
  reviewer: [{ to: '/projects', label: 'Projects' }, { to: '/review', label: 'Review queue' }],
  auditor: [{ to: '/projects', label: 'Projects' }, { to: '/audit', label: 'Audit' }, { to: '/overview', label: 'Overview' }],
  lead: [
    { to: '/projects', label: 'Projects' }, { to: '/overview', label: 'Overview' }, { to: '/calibration', label: 'Calibration' },
    { to: '/audit', label: 'Audit' },
  ],
  admin: [
    { to: '/projects', label: 'Projects' },
    { to: '/admin/users', label: 'Users' },
    { to: '/admin/projects', label: 'Manage projects' },
    { to: '/admin/mail', label: 'Mail' },
  ],
}

// Every role reads the guidance articles.
const GUIDANCE_ITEM: NavItem = { to: '/guidance', label: 'Guidance' }

export function navFor(role: Role | undefined): NavItem[] {
  return role ? [...NAV[role], GUIDANCE_ITEM] : []
}
