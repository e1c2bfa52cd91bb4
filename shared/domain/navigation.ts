import type { Role } from './enums'

/** The main sections and the roles each one serves. The server checks every route on its own; this only decides what the menu shows. */
export interface Section {
  to: string
  label: string
  roles: readonly Role[]
}

const everyone = ['admin', 'qa', 'owner', 'viewer'] as const

export const SECTIONS: readonly Section[] = [
  { to: '/', label: 'Board', roles: everyone },
  { to: '/reference-sets', label: 'Reference sets', roles: everyone },
  { to: '/codes', label: 'Codes', roles: everyone },
  { to: '/deviations', label: 'Deviations', roles: everyone },
  { to: '/submit', label: 'Submit', roles: ['admin', 'qa'] },
  { to: '/audit', label: 'Audit trail', roles: ['admin', 'viewer'] },
  { to: '/admin', label: 'Admin', roles: ['admin'] },
]

export function sectionsFor(role: Role | undefined): Section[] {
  if (!role) return []
  return SECTIONS.filter(s => s.roles.includes(role))
}
