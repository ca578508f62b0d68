// Forgotten passwords: a one-time link, valid for an hour, mailed to the account's address.
import { Op } from 'sequelize'
import type { UserInstance } from '../models'
import { hashToken, newToken } from '../database/tokens'

export const RESET_LIFETIME_MS = 60 * 60 * 1000

export async function sendPasswordReset(user: UserInstance): Promise<void> {
  const origin = publicOrigin()
  const { PasswordReset } = await useModels()
  const { token, tokenHash } = newToken()
  await PasswordReset.create({ userId: user.id, tokenHash, expiresAt: new Date(Date.now() + RESET_LIFETIME_MS) })
  const link = `${origin}/reset/${token}`
  await sendMail({ to: user.email, kind: 'password-reset', ...passwordResetMail({ name: user.name, link }) })
}

/**
 * Uses the token (once) and sets the password; 400 for an unknown, used or expired link. Every
 * session of the account ends and its live sockets close.
 */
export async function resetPassword(token: string, passwordHash: string): Promise<UserInstance> {
  const sequelize = await useDb()
  const { PasswordReset, User } = await useModels()
  return sequelize.transaction(async (transaction) => {
    const reset = await PasswordReset.findOne({
      where: { tokenHash: hashToken(token), usedAt: null, expiresAt: { [Op.gt]: new Date() } },
      transaction,
    })
    const user = reset && await User.findByPk(reset.userId, { transaction })
    if (!reset || !user) {
      throw createError({ statusCode: 400, message: 'This reset link is invalid, already used or expired: ask for a new one.' })
    }
    // Every outstanding link of the account is used up with this one, not only the one clicked.
    await PasswordReset.update({ usedAt: new Date() }, { where: { userId: user.id, usedAt: null }, transaction })
    user.passwordHash = passwordHash
    user.sessionVersion += 1
    await user.save({ transaction })
    await revokeAllSessions(user.id, transaction)
    return user
  }).then((user) => {
    closeUserSockets(user.id)
    return user
  })
}
