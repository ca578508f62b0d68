// Sign-in attempts are counted per account and per client address over a sliding window; either
// reaching the limit refuses further attempts (429) until old attempts age out.
// The attempt is reserved (counted) before the password is checked, in one atomic step with the
// check: counting only after scrypt let 40 parallel guesses all pass a check made before any of
// them had been recorded. A successful sign-in gives its reservation back.
// The limiter sits behind `LoginLimiter`; its rows live in the database, which several nodes share.
import type { H3Event } from 'h3'
import { Op } from 'sequelize'
import { lockWithin } from '../database/connection'

export const LOGIN_FAILURE_LIMIT = 10
export const LOGIN_WINDOW_MS = 15 * 60 * 1000

/**
 * The TCP peer's address. WARNING: never X-Forwarded-For or similar headers — any client can
 * send those, and a limiter keyed on them resets with each forged value.
 */
export function clientAddress(event: H3Event): string {
  return event.node.req.socket.remoteAddress ?? 'unknown'
}

/** One counted attempt, held while the password is checked. */
export interface LoginReservation {
  /** The password matched: the account's count is cleared and this attempt is not held against the address. */
  succeeded(): Promise<void>
}

export interface LoginLimiter {
  /** Counts an attempt against the account and the address, or answers null (nothing counted) when either is at the limit. */
  reserve(email: string, address: string): Promise<LoginReservation | null>
  /** Clears the account's count (after a password reset). */
  clearAccount(email: string): Promise<void>
}

/**
 * Rows in login_failures, reserved inside one transaction: serialised and immediate on SQLite, under
 * an advisory lock on PostgreSQL, so several nodes on one database grant no more tries than one.
 * `kind` prefixes the rows' scopes so other limits (forgotten password) share the table.
 */
export function createSqlLoginLimiter(limit = { account: LOGIN_FAILURE_LIMIT, address: LOGIN_FAILURE_LIMIT }, windowMs = LOGIN_WINDOW_MS, kind = ''): LoginLimiter {
  const accountScope = `${kind}account`
  const addressScope = `${kind}address`
  const clearAccount = async (email: string) => {
    const { LoginFailure } = await useModels()
    await LoginFailure.destroy({ where: { scope: accountScope, key: email } })
  }
  return {
    async reserve(email, address) {
      const sequelize = await useDb()
      const { LoginFailure } = await useModels()
      const ids = await sequelize.transaction(async (transaction) => {
        // Count-and-insert as one step on every node of the database (see lockWithin).
        await lockWithin(sequelize, transaction, `${kind}sign-in limit`)
        const since = new Date(Date.now() - windowMs)
        await LoginFailure.destroy({ where: { scope: [accountScope, addressScope], createdAt: { [Op.lt]: since } }, transaction })
        const recent = { [Op.gte]: since }
        const forAccount = await LoginFailure.count({ where: { scope: accountScope, key: email, createdAt: recent }, transaction })
        const forAddress = await LoginFailure.count({ where: { scope: addressScope, key: address, createdAt: recent }, transaction })
        if (forAccount >= limit.account || forAddress >= limit.address) return null
        const account = await LoginFailure.create({ scope: accountScope, key: email }, { transaction })
        const client = await LoginFailure.create({ scope: addressScope, key: address }, { transaction })
        return [account.id, client.id]
      })
      if (!ids) return null
      return {
        async succeeded() {
          await clearAccount(email)
          await LoginFailure.destroy({ where: { id: ids } })
        },
      }
    },
    clearAccount,
  }
}

/**
 * Forgotten-password requests: each mails a link, so the account's limit is low (a victim's inbox
 * must not be flooded) and the address's a little higher (a shared office address).
 */
export const FORGOT_LIMIT = { account: 3, address: 20 }

let limiter: LoginLimiter | undefined
let forgotLimiter: LoginLimiter | undefined

export function useLoginLimiter(): LoginLimiter {
  limiter ??= createSqlLoginLimiter()
  return limiter
}

export function useForgotLimiter(): LoginLimiter {
  forgotLimiter ??= createSqlLoginLimiter(FORGOT_LIMIT, LOGIN_WINDOW_MS, 'forgot-')
  return forgotLimiter
}
