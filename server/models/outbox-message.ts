import { DataTypes, type Model, type Optional, type Sequelize } from 'sequelize'

// A message caught by the local SMTP catcher (dev, demo and test only).
export interface OutboxMessageRow {
  id: number
  workspaceId: number | null
  kind: string | null
  mailFrom: string
  /** Comma-separated recipient addresses. */
  mailTo: string
  subject: string
  textBody: string
  htmlBody: string
  raw: string
  createdAt: Date
  updatedAt: Date
}
export type OutboxMessageInstance = Model<OutboxMessageRow, Optional<OutboxMessageRow, 'id' | 'workspaceId' | 'kind' | 'createdAt' | 'updatedAt'>> & OutboxMessageRow

export function defineOutboxMessage(sequelize: Sequelize) {
  return sequelize.define<OutboxMessageInstance>('OutboxMessage', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    workspaceId: { type: DataTypes.INTEGER, allowNull: true },
    kind: { type: DataTypes.STRING(32), allowNull: true },
    mailFrom: { type: DataTypes.STRING(320), allowNull: false },
    mailTo: { type: DataTypes.TEXT, allowNull: false },
    subject: { type: DataTypes.STRING(500), allowNull: false },
    textBody: { type: DataTypes.TEXT, allowNull: false },
    htmlBody: { type: DataTypes.TEXT, allowNull: false },
    raw: { type: DataTypes.TEXT, allowNull: false },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  }, { tableName: 'outbox', underscored: true })
}

export function serializeOutboxMessage(message: OutboxMessageRow) {
  return {
    id: message.id,
    kind: message.kind,
    from: message.mailFrom,
    to: message.mailTo.split(',').filter(Boolean),
    subject: message.subject,
    text: message.textBody,
    html: message.htmlBody,
    createdAt: message.createdAt.toISOString(),
  }
}
export type PublicOutboxMessage = ReturnType<typeof serializeOutboxMessage>
