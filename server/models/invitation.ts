import { DataTypes, type Model, type Optional, type Sequelize } from 'sequelize'
import type { Role } from './membership'

export interface InvitationRow {
  id: number
  workspaceId: number
  email: string
  role: Role
  tokenHash: string
  invitedBy: number | null
  expiresAt: Date
  acceptedAt: Date | null
  acceptedBy: number | null
  createdAt: Date
  updatedAt: Date
}
export type InvitationInstance = Model<InvitationRow, Optional<InvitationRow, 'id' | 'invitedBy' | 'acceptedAt' | 'acceptedBy' | 'createdAt' | 'updatedAt'>> & InvitationRow

export function defineInvitation(sequelize: Sequelize) {
  return sequelize.define<InvitationInstance>('Invitation', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    workspaceId: { type: DataTypes.INTEGER, allowNull: false },
    email: { type: DataTypes.STRING(254), allowNull: false },
    role: { type: DataTypes.STRING(16), allowNull: false },
    tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    invitedBy: { type: DataTypes.INTEGER, allowNull: true },
    expiresAt: { type: DataTypes.DATE, allowNull: false },
    acceptedAt: { type: DataTypes.DATE, allowNull: true },
    acceptedBy: { type: DataTypes.INTEGER, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  }, { tableName: 'invitations', underscored: true })
}

export interface PublicInvitation { id: number, email: string, role: Role, expiresAt: string, createdAt: string }

export function serializeInvitation(invitation: InvitationRow): PublicInvitation {
  return {
    id: invitation.id,
    email: invitation.email,
    role: invitation.role,
    expiresAt: invitation.expiresAt.toISOString(),
    createdAt: invitation.createdAt.toISOString(),
  }
}
