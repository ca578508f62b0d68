// Operator commands against the server's database: GAMMABOARD_DATABASE_URL (PostgreSQL) when set,
// else the SQLite file GAMMABOARD_DB (default data/gammaboard.sqlite).
//   npm run admin -- user:add --email E --password P --name N --workspace SLUG --role admin|designer|reviewer [--workspace-name "Team"]
// Creates the user (and the workspace if it is new) and gives them the role there. Pending
// migrations are applied first, exactly as the server does at start.
import { parseArgs } from 'node:util'
import { z } from 'zod'
import { openDatabase } from '../server/database/connection'
import { migrateToLatest, underStartupLock } from '../server/database/migrate'
import { createUser, createWorkspace, setMembership } from '../server/database/accounts'
import { hashPasswordOffline } from '../server/database/passwords'
import { modelsFor } from '../server/models'
import { EmailSchema, NameSchema, PasswordSchema, RoleSchema, SlugSchema } from '../server/utils/schemas'

const USAGE = 'usage: npm run admin -- user:add --email E --password P --name N --workspace SLUG --role admin|designer|reviewer [--workspace-name NAME]'

const UserAddSchema = z.object({
  email: EmailSchema,
  password: PasswordSchema,
  name: NameSchema,
  workspace: SlugSchema,
  role: RoleSchema,
  'workspace-name': NameSchema.optional(),
})

function titleFromSlug(slug: string): string {
  return slug.split('-').map(word => word.charAt(0).toUpperCase() + word.slice(1)).join(' ')
}

async function userAdd(argv: string[]): Promise<string> {
  const { values } = parseArgs({
    args: argv,
    options: {
      'email': { type: 'string' }, 'password': { type: 'string' }, 'name': { type: 'string' },
      'workspace': { type: 'string' }, 'role': { type: 'string' }, 'workspace-name': { type: 'string' },
    },
    strict: true,
  })
  const parsed = UserAddSchema.safeParse(values)
  if (!parsed.success) {
    const problems = parsed.error.issues.map(i => `--${i.path.join('.')}: ${i.message}`).join('\n')
    throw new Error(`${problems}\n${USAGE}`)
  }
  const input = parsed.data
  const sequelize = await openDatabase()
  try {
    await underStartupLock(sequelize, () => migrateToLatest(sequelize))
    const { User, Workspace } = modelsFor(sequelize)
    const passwordHash = await hashPasswordOffline(input.password)
    return await sequelize.transaction(async (transaction) => {
      const notes: string[] = []
      let workspace = await Workspace.findOne({ where: { slug: input.workspace }, transaction })
      if (!workspace) {
        workspace = await createWorkspace(sequelize, { slug: input.workspace, name: input['workspace-name'] ?? titleFromSlug(input.workspace) }, transaction)
        notes.push(`created workspace ${workspace.slug} "${workspace.name}"`)
      }
      let user = await User.findOne({ where: { email: input.email }, transaction })
      if (user) notes.push(`user ${user.email} already exists (password and name left unchanged)`)
      else {
        user = await createUser(sequelize, { email: input.email, name: input.name, passwordHash }, transaction)
        notes.push(`created user ${user.email} (id ${user.id})`)
      }
      await setMembership(sequelize, { userId: user.id, workspaceId: workspace.id, role: input.role }, transaction)
      notes.push(`${user.email} is ${input.role} in ${workspace.slug}`)
      return notes.join('\n')
    })
  }
  finally {
    await sequelize.close()
  }
}

async function main() {
  const [command, ...rest] = process.argv.slice(2)
  if (command !== 'user:add') throw new Error(`unknown command ${command ?? '(none)'}\n${USAGE}`)
  console.log(await userAdd(rest))
}

main().catch((error: unknown) => {
  console.error(error instanceof Error ? error.message : error)
  process.exit(1)
})
