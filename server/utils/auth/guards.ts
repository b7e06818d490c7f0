import type { H3Event } from 'h3'
import { notFound } from '../http/errors'
import { and, eq } from 'drizzle-orm'
import type { Role } from '#shared/utils/roles'
import { READS_ALL_PROJECTS } from '#shared/utils/roles'
import { decisionReadRefusal, decisionRefusal, type DecisionAction } from '../decisions/policy'
import { findDecisionForMember, readDecisionForReader } from '../decisions/queries'
import { requireProject } from '../projects/projects'
import { requireUser } from './session'
import { tables, useDb } from '../db'

// Who may read or act on a project or a decision: the guards every route calls after validating.

export async function isProjectMember(projectId: number, userId: number): Promise<boolean> {
  const row = await useDb().query.projectMembers.findFirst({
    where: and(eq(tables.projectMembers.projectId, projectId), eq(tables.projectMembers.userId, userId)),
  })
  return Boolean(row)
}

/**
 * Read access to a project: auditors, leads and admins read every project; engineers and
 * reviewers only those they are members of. 404 for a project that does not exist.
 */
export async function requireProjectRead(event: H3Event, projectId: number) {
  const user = await requireUser(event)
  const project = await requireProject(projectId)
  if (!READS_ALL_PROJECTS.includes(user.role) && !(await isProjectMember(projectId, user.id))) {
    throw createError({ statusCode: 403, message: 'You are not a member of this project' })
  }
  return { user, project }
}

/** Work inside a project: a member with one of the given roles. */
export async function requireProjectMember(event: H3Event, projectId: number, roles: Role[] = ['engineer', 'reviewer']) {
  const user = await requireUser(event)
  const project = await requireProject(projectId)
  if (!roles.includes(user.role)) {
    throw createError({ statusCode: 403, message: `This needs the role ${roles.join(' or ')} in the project` })
  }
  if (!(await isProjectMember(projectId, user.id))) {
    throw createError({ statusCode: 403, message: 'You are not a member of this project' })
  }
  return { user, project }
}

/**
 * A project's decisions: its engineer and reviewer members, auditors and leads (not administrators,
 * who manage accounts and projects). 404 for a project that does not exist.
 */
export async function requireProjectDecisions(event: H3Event, projectId: number) {
  const user = await requireUser(event)
  const project = await requireProject(projectId)
  const isMember = await isProjectMember(projectId, user.id)
  const refusal = decisionReadRefusal(user, isMember)
  if (refusal) throw createError(refusal)
  return { user, project, isMember }
}

/**
 * One decision, read or acted on: 404 when it does not exist, else the refusal (403 for who the
 * user is, 409 for the decision's state) from the same rules that set the page's permissions.
 */
export async function requireDecisionAccess(event: H3Event, decisionId: number, action: DecisionAction | 'read' = 'read') {
  const user = await requireUser(event)
  const found = await findDecisionForMember(decisionId, user.id)
  if (!found) throw notFound(`Decision ${decisionId} does not exist`)
  const { decision, isMember } = found
  const refusal = action === 'read' ? decisionReadRefusal(user, isMember) : decisionRefusal(user, decision, isMember, action)
  if (refusal) throw createError(refusal)
  return { user, decision, isMember }
}

/**
 * Reading a decision's page: the guard's check from the same read that fetches the decision, its
 * current revision, author and project, so the page costs this query and its history's.
 */
export async function requireDecisionRead(event: H3Event, decisionId: number) {
  const user = await requireUser(event)
  const found = await readDecisionForReader(decisionId, user.id)
  const refusal = decisionReadRefusal(user, found.isMember)
  if (refusal) throw createError(refusal)
  return { user, found }
}
