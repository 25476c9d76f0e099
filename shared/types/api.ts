/** Response shapes shared by routes and pages. */
import type { ProjectRole, SiteRole } from './roles'

export interface ProjectListItem {
  id: number
  name: string
  description: string
  role: ProjectRole
  memberCount: number
  graphCount: number
  updatedAt: string
}

export interface ProjectDetail {
  id: number
  name: string
  description: string
  role: ProjectRole
  createdAt: string
  updatedAt: string
}

export interface MemberItem {
  userId: number
  name: string
  email: string
  role: ProjectRole
  joinedAt: string
}

/** A gluing pattern in a project's list; `summary` is the stored analysis summary or null. */
export interface GraphListItem {
  id: number
  name: string
  description: string
  version: number
  summary: Record<string, unknown> | null
  updatedAt: string
}

export interface AdminUserItem {
  id: number
  name: string
  email: string
  siteRole: SiteRole
  projectCount: number
  createdAt: string
}

export interface AccountInfo {
  id: number
  name: string
  email: string
  siteRole: SiteRole
  notifyOptOut: boolean
  createdAt: string
}
