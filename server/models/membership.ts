import { DataTypes, type Model, type Optional, type Sequelize } from 'sequelize'

import { ROLES, type Role } from '../../shared/accounts/fields'

export { ROLES, type Role }

/** Roles are ordered: each one may do everything the ones before it may. */
export function roleAtLeast(role: Role, minimum: Role): boolean {
  return ROLES.indexOf(role) >= ROLES.indexOf(minimum)
}

export interface MembershipRow {
  id: number
  userId: number
  workspaceId: number
  role: Role
  createdAt: Date
  updatedAt: Date
}
export type MembershipInstance = Model<MembershipRow, Optional<MembershipRow, 'id' | 'createdAt' | 'updatedAt'>> & MembershipRow

export function defineMembership(sequelize: Sequelize) {
  return sequelize.define<MembershipInstance>('Membership', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    userId: { type: DataTypes.INTEGER, allowNull: false },
    workspaceId: { type: DataTypes.INTEGER, allowNull: false },
    role: { type: DataTypes.STRING(16), allowNull: false },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  }, { tableName: 'memberships', underscored: true })
}

import type { PublicMember } from '../../shared/types/api'

export type { PublicMember } from '../../shared/types/api'

export function serializeMember(membership: MembershipRow, user: { name: string, email: string }): PublicMember {
  return { userId: membership.userId, name: user.name, email: user.email, role: membership.role, since: membership.createdAt.toISOString() }
}
