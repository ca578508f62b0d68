// Workspace membership queries and rules used by several routes.
import type { Transaction } from 'sequelize'
import { serializeMember, serializeWorkspace, type PublicMember, type Role, type UserInstance } from '../models'
import { lockWithin } from '../database/connection'

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
export async function assertKeepsAnAdmin(workspaceId: number, currentRole: Role, nextRole: Role | null, transaction?: Transaction): Promise<void> {
  if (currentRole !== 'admin' || nextRole === 'admin') return
  if (await adminCount(workspaceId, transaction) <= 1) {
    throw createError({ statusCode: 422, message: 'A workspace needs at least one admin: make someone else an admin first.' })
  }
}

export async function findMember(workspaceId: number, userId: number, transaction?: Transaction) {
  const { Membership } = await useModels()
  const membership = await Membership.findOne({ where: { workspaceId, userId }, transaction })
  if (!membership) throw createError({ statusCode: 404, message: 'No such member in this workspace.' })
  return membership
}

/**
 * Changes a member's role (null: removes them), refusing to leave the workspace without an admin.
 * The admin count and the change are one immediate transaction: two admins demoting each other at
 * the same moment both counted two admins before either wrote, and left none.
 */
export async function changeMembership(workspaceId: number, userId: number, role: Role | null) {
  const sequelize = await useDb()
  return sequelize.transaction(async (transaction) => {
    await lockWithin(sequelize, transaction, `workspace-members:${workspaceId}`)
    const membership = await findMember(workspaceId, userId, transaction)
    await assertKeepsAnAdmin(workspaceId, membership.role, role, transaction)
    if (role === null) await membership.destroy({ transaction })
    else {
      membership.role = role
      await membership.save({ transaction })
    }
    return membership
  })
}
