import { and, asc, eq, inArray, sql } from 'drizzle-orm'
import { notFound } from '../http/errors'
import type { ProjectCreateBody, ProjectUpdateBody } from '#shared/schemas/projects'
import { READS_ALL_PROJECTS } from '#shared/utils/roles'
import type { SessionUser } from '#shared/types/session'
import { publicUserColumns } from '../accounts/users'
import { tables, useDb } from '../db'

const memberCount = sql<number>`(SELECT count(*)::int FROM project_members pm WHERE pm.project_id = ${tables.projects.id})`

/** The projects a user may read: every project for auditors, leads and admins; else their own. */
export async function listProjectsFor(user: SessionUser) {
  const db = useDb()
  const query = db.select({
    id: tables.projects.id, code: tables.projects.code, name: tables.projects.name,
    client: tables.projects.client, description: tables.projects.description,
    archived: tables.projects.archived, updatedAt: tables.projects.updatedAt, memberCount,
  }).from(tables.projects)
  if (READS_ALL_PROJECTS.includes(user.role)) return query.orderBy(asc(tables.projects.code))
  const mine = db.select({ id: tables.projectMembers.projectId }).from(tables.projectMembers)
    .where(eq(tables.projectMembers.userId, user.id))
  return query.where(inArray(tables.projects.id, mine)).orderBy(asc(tables.projects.code))
}

export function listMembers(projectId: number) {
  return useDb().select(publicUserColumns).from(tables.projectMembers)
    .innerJoin(tables.users, eq(tables.users.id, tables.projectMembers.userId))
    .where(eq(tables.projectMembers.projectId, projectId)).orderBy(asc(tables.users.name))
}

async function assertCodeFree(code: string, exceptId?: number) {
  const other = await useDb().query.projects.findFirst({ where: eq(tables.projects.code, code) })
  if (other && other.id !== exceptId) throw createError({ statusCode: 409, message: `Project code ${code} is already used` })
}

export async function createProject(body: ProjectCreateBody) {
  await assertCodeFree(body.code)
  const [project] = await useDb().insert(tables.projects).values(body).returning()
  return project!
}

export async function updateProject(id: number, body: ProjectUpdateBody) {
  if (body.code) await assertCodeFree(body.code, id)
  const [project] = await useDb().update(tables.projects).set({ ...body, updatedAt: new Date() })
    .where(eq(tables.projects.id, id)).returning()
  if (!project) throw notFound(`Project ${id} does not exist`)
  return project
}

/** The project, or 404. */
export async function requireProject(projectId: number) {
  const project = await useDb().query.projects.findFirst({ where: eq(tables.projects.id, projectId) })
  if (!project) throw notFound(`Project ${projectId} does not exist`)
  return project
}

export async function addMember(projectId: number, userId: number) {
  const db = useDb()
  await requireProject(projectId)
  const user = await db.query.users.findFirst({ where: eq(tables.users.id, userId) })
  if (!user) throw notFound(`User ${userId} does not exist`)
  await db.insert(tables.projectMembers).values({ projectId, userId }).onConflictDoNothing()
  return listMembers(projectId)
}

export async function removeMember(projectId: number, userId: number) {
  const removed = await useDb().delete(tables.projectMembers)
    .where(and(eq(tables.projectMembers.projectId, projectId), eq(tables.projectMembers.userId, userId)))
    .returning()
  if (!removed.length) throw notFound(`User ${userId} is not a member of project ${projectId}`)
  return listMembers(projectId)
}
