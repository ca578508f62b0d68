// Workspace membership queries and rules used by several routes.
import type { Transaction } from 'sequelize'
import { serializeMember, serializeWorkspace, type PublicMember, type Role, type UserInstance } from '../models'

export async function workspacesOf(userId: number) {
  const { Membership, Workspace } = await useModels()
  const memberships = await Membership.findAll({
    where: { userId },
    include: [{ model: Workspace, as: 'workspace' }],
    order: [['createdAt', 'ASC'], ['id', 'ASC']],
  })
  return memberships.map((m) => {
    const workspace = (m as unknown as { workspace: Parameters<typeof serializeWorkspace>[0] }).workspace
    return { ...serializeWorkspace(workspace), role: m.role }
  })
}

export async function membersOf(workspaceId: number): Promise<PublicMember[]> {
  const { Membership, User } = await useModels()
  const memberships = await Membership.findAll({
    where: { workspaceId },
    include: [{ model: User, as: 'user', attributes: ['id', 'name', 'email'] }],
    order: [['createdAt', 'ASC'], ['id', 'ASC']],
  })
  return memberships.map(m => serializeMember(m, (m as unknown as { user: UserInstance }).user))
}

export async function adminCount(workspaceId: number, transaction?: Transaction): Promise<number> {
  const { Membership } = await useModels()
  return Membership.count({ where: { workspaceId, role: 'admin' }, transaction })
}

/** Refuses a change that would leave the workspace without an admin. */
export async function assertKeepsAnAdmin(workspaceId: number, currentRole: Role, nextRole: Role | null): Promise<void> {
  if (currentRole !== 'admin' || nextRole === 'admin') return
  if (await adminCount(workspaceId) <= 1) {
    throw createError({ statusCode: 422, message: 'A workspace needs at least one admin: make someone else an admin first.' })
  }
}

export async function findMember(workspaceId: number, userId: number) {
  const { Membership } = await useModels()
  const membership = await Membership.findOne({ where: { workspaceId, userId } })
  if (!membership) throw createError({ statusCode: 404, message: 'No such member in this workspace.' })
  return membership
}
