/**
 * The invented demo research group. Every name here is made up; the passwords are for local demos
 * only and are printed in README.md. Never use them on a shared server.
 */
import type { ProjectRole, SiteRole } from '../../shared/types/roles'

/** One demo account. */
export interface DemoAccount {
  key: 'admin' | 'owner' | 'editor' | 'viewer'
  name: string
  email: string
  password: string
  siteRole: SiteRole
}

/** The lab the demo data pretends to be. */
export const DEMO_LAB = 'Lantern Bay Surface Geometry Group'

export const DEMO_ACCOUNTS: readonly DemoAccount[] = [
  { key: 'admin', name: 'Ilse Varrow', email: 'admin@lanternbay.example', password: 'demo-admin-2026',
    siteRole: 'admin' },
  { key: 'owner', name: 'Tomas Quillon', email: 'owner@lanternbay.example', password: 'demo-owner-2026',
    siteRole: 'member' },
  { key: 'editor', name: 'Neve Ashdown', email: 'editor@lanternbay.example', password: 'demo-editor-2026',
    siteRole: 'member' },
  { key: 'viewer', name: 'Rafi Okonkwe', email: 'viewer@lanternbay.example', password: 'demo-viewer-2026',
    siteRole: 'member' },
]

/** One demo project: name, description, and who has which role (by account key). */
export interface DemoProject {
  name: string
  description: string
  members: Array<{ key: DemoAccount['key'], role: ProjectRole }>
}

export const DEMO_PROJECTS: readonly DemoProject[] = [
  {
    name: 'Genus-three torus gluings',
    description: `${DEMO_LAB}: balanced, rigid gluing patterns in the flat torus, their lattice and phase families, and where those families end.`,
    members: [{ key: 'owner', role: 'owner' }, { key: 'editor', role: 'editor' }, { key: 'viewer', role: 'viewer' }],
  },
  {
    name: 'Open-wing towers in the plane',
    description: `${DEMO_LAB}: singly periodic constructions with open wings; turning wings until the cyclic order flips.`,
    members: [{ key: 'owner', role: 'owner' }, { key: 'editor', role: 'viewer' }],
  },
]
