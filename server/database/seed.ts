// The demo team: Brackwater Sensor Works (invented), with one account per role, the demo boards and
// one published template. Runs only on a database without users, so a restart never duplicates it.
import { randomUUID } from 'node:crypto'
import type { Sequelize } from 'sequelize'
import { modelsFor, type Role } from '../models'
import { DEMO_BOARDS } from '../../shared/board/demo-boards'
import { boardFromState } from '../../shared/board/ydoc'
import { createUser, createWorkspace, setMembership } from './accounts'
import { contentJson, createBoardRow, stateBytes } from './board-store'
import { hashPasswordOffline } from './passwords'

export const DEMO_WORKSPACE = { slug: 'brackwater', name: 'Brackwater Sensor Works' }

export const DEMO_ACCOUNTS: { name: string, email: string, password: string, role: Role }[] = [
  { name: 'Mara Quell', email: 'mara@brackwater.example', password: 'brackwater-admin-demo', role: 'admin' },
  { name: 'Tomas Reyes', email: 'tomas@brackwater.example', password: 'brackwater-designer-demo', role: 'designer' },
  { name: 'Ines Halvorsen', email: 'ines@brackwater.example', password: 'brackwater-reviewer-demo', role: 'reviewer' },
]

export const DEMO_TEMPLATE_NAME = '915 MHz chip antenna, series L + shunt C'

/** Seeds the demo team; returns false (and does nothing) when the database already has users. */
export async function seedDemo(sequelize: Sequelize): Promise<boolean> {
  const { User, Snapshot, Template } = modelsFor(sequelize)
  if (await User.count()) return false
  // Hash outside the transaction: scrypt is slow on purpose and SQLite has one writer.
  const hashes = await Promise.all(DEMO_ACCOUNTS.map(a => hashPasswordOffline(a.password)))
  await sequelize.transaction(async (transaction) => {
    const workspace = await createWorkspace(sequelize, DEMO_WORKSPACE, transaction)
    const users = []
    for (const [i, account] of DEMO_ACCOUNTS.entries()) {
      const user = await createUser(sequelize, { ...account, passwordHash: hashes[i]! }, transaction)
      await setMembership(sequelize, { userId: user.id, workspaceId: workspace.id, role: account.role }, transaction)
      users.push(user)
    }
    const [admin, designer] = users
    const boards = []
    for (const demo of DEMO_BOARDS) {
      boards.push(await createBoardRow(sequelize, {
        id: demo.id, workspaceId: workspace.id, name: demo.name, createdBy: designer!.id,
        content: { settings: demo.settings, elements: demo.elements },
      }, transaction))
    }
    const first = boards[0]!
    const snapshot = await Snapshot.create({
      id: randomUUID(), boardId: first.id, label: 'First L-match from the carrier-board measurement',
      authorId: designer!.id, state: first.state, summary: contentJson(boardFromState(stateBytes(first))),
    }, { transaction })
    await Template.create({
      id: randomUUID(), workspaceId: workspace.id, snapshotId: snapshot.id, name: DEMO_TEMPLATE_NAME,
      state: snapshot.state, summary: snapshot.summary, publishedBy: admin!.id,
    }, { transaction })
  })
  return true
}
