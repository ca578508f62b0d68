// Creating people, teams and memberships. Shared by the server routes, the demo seed and the
// admin command line, so a user made by any of them looks the same.
import { randomBytes } from 'node:crypto'
import type { Sequelize, Transaction } from 'sequelize'
import { modelsFor, normalizeEmail, slugFromName, type Role, type UserInstance, type WorkspaceInstance } from '../models'

export async function createUser(
  sequelize: Sequelize,
  input: { email: string, name: string, passwordHash: string },
  transaction?: Transaction,
): Promise<UserInstance> {
  const { User } = modelsFor(sequelize)
  return User.create({ email: normalizeEmail(input.email), name: input.name.trim(), passwordHash: input.passwordHash }, { transaction })
}

/** A workspace with the given slug, or one derived from the name with a random suffix if taken. */
export async function createWorkspace(
  sequelize: Sequelize,
  input: { name: string, slug?: string },
  transaction?: Transaction,
): Promise<WorkspaceInstance> {
  const { Workspace } = modelsFor(sequelize)
  const base = input.slug ?? slugFromName(input.name)
  let slug = base
  while (await Workspace.count({ where: { slug }, transaction })) {
    slug = `${base}-${randomBytes(3).toString('hex')}`
  }
  return Workspace.create({ slug, name: input.name.trim() }, { transaction })
}

/** Adds the membership, or changes its role when the user already belongs to the workspace. */
export async function setMembership(
  sequelize: Sequelize,
  input: { userId: number, workspaceId: number, role: Role },
  transaction?: Transaction,
) {
  const { Membership } = modelsFor(sequelize)
  const existing = await Membership.findOne({ where: { userId: input.userId, workspaceId: input.workspaceId }, transaction })
  if (existing) {
    existing.role = input.role
    await existing.save({ transaction })
    return existing
  }
  return Membership.create(input, { transaction })
}
