// All models for one Sequelize instance, defined once and cached. Explicit imports only, so the
// command-line tools (scripts/admin.ts) and the server share them.
import type { Sequelize } from 'sequelize'
import { defineUser } from './user'
import { defineWorkspace } from './workspace'
import { defineMembership } from './membership'
import { defineInvitation } from './invitation'
import { definePasswordReset } from './password-reset'
import { defineBoard } from './board'
import { defineBoardUpdate } from './board-update'
import { defineSnapshot } from './snapshot'
import { defineTemplate } from './template'
import { defineUpload } from './upload'
import { defineOutboxMessage } from './outbox-message'
import { defineLoginFailure } from './login-failure'
import { defineSession } from './session'
import { defineComment } from './comment'
import { defineVerdict } from './verdict'
import { definePart } from './part'

function defineAll(sequelize: Sequelize) {
  const models = {
    User: defineUser(sequelize),
    Workspace: defineWorkspace(sequelize),
    Membership: defineMembership(sequelize),
    Invitation: defineInvitation(sequelize),
    PasswordReset: definePasswordReset(sequelize),
    Board: defineBoard(sequelize),
    BoardUpdate: defineBoardUpdate(sequelize),
    Snapshot: defineSnapshot(sequelize),
    Template: defineTemplate(sequelize),
    Upload: defineUpload(sequelize),
    OutboxMessage: defineOutboxMessage(sequelize),
    LoginFailure: defineLoginFailure(sequelize),
    Session: defineSession(sequelize),
    Comment: defineComment(sequelize),
    Verdict: defineVerdict(sequelize),
    Part: definePart(sequelize),
  }
  const { User, Workspace, Membership, Board, Snapshot, Template, Comment, Verdict } = models
  Membership.belongsTo(User, { foreignKey: 'userId', as: 'user' })
  Membership.belongsTo(Workspace, { foreignKey: 'workspaceId', as: 'workspace' })
  Board.belongsTo(Workspace, { foreignKey: 'workspaceId', as: 'workspace' })
  Snapshot.belongsTo(User, { foreignKey: 'authorId', as: 'author' })
  Snapshot.belongsTo(Board, { foreignKey: 'boardId', as: 'board' })
  Template.belongsTo(User, { foreignKey: 'publishedBy', as: 'publisher' })
  Comment.belongsTo(User, { foreignKey: 'authorId', as: 'author' })
  Verdict.belongsTo(User, { foreignKey: 'giverId', as: 'giver' })
  Snapshot.hasMany(Verdict, { foreignKey: 'snapshotId', as: 'verdicts' })
  return models
}

export type Models = ReturnType<typeof defineAll>

const cache = new WeakMap<Sequelize, Models>()

export function modelsFor(sequelize: Sequelize): Models {
  let models = cache.get(sequelize)
  if (!models) {
    models = defineAll(sequelize)
    cache.set(sequelize, models)
  }
  return models
}

export * from './user'
export * from './workspace'
export * from './membership'
export * from './invitation'
export * from './password-reset'
export * from './board'
export * from './board-update'
export * from './snapshot'
export * from './template'
export * from './upload'
export * from './outbox-message'
export * from './login-failure'
export * from './session'
export * from './comment'
export * from './verdict'
export * from './part'
