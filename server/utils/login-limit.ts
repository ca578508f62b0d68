// Failed sign-ins are counted per account and per client address over a sliding window; either
// reaching the limit refuses further attempts (429) until old failures age out.
import type { H3Event } from 'h3'
import { Op } from 'sequelize'

export const LOGIN_FAILURE_LIMIT = 10
export const LOGIN_WINDOW_MS = 15 * 60 * 1000

/**
 * The TCP peer's address. WARNING: never X-Forwarded-For or similar headers — any client can
 * send those, and a limiter keyed on them resets with each forged value.
 */
export function clientAddress(event: H3Event): string {
  return event.node.req.socket.remoteAddress ?? 'unknown'
}

function windowStart(): Date {
  return new Date(Date.now() - LOGIN_WINDOW_MS)
}

export async function isLoginBlocked(email: string, address: string): Promise<boolean> {
  const { LoginFailure } = await useModels()
  const since = { [Op.gte]: windowStart() }
  const [forAccount, forAddress] = await Promise.all([
    LoginFailure.count({ where: { scope: 'account', key: email, createdAt: since } }),
    LoginFailure.count({ where: { scope: 'address', key: address, createdAt: since } }),
  ])
  return forAccount >= LOGIN_FAILURE_LIMIT || forAddress >= LOGIN_FAILURE_LIMIT
}

export async function recordLoginFailure(email: string, address: string): Promise<void> {
  const { LoginFailure } = await useModels()
  await LoginFailure.destroy({ where: { createdAt: { [Op.lt]: windowStart() } } })
  await LoginFailure.bulkCreate([{ scope: 'account', key: email }, { scope: 'address', key: address }])
}

/** A successful sign-in clears the account's count (the address keeps its own). */
export async function clearAccountFailures(email: string): Promise<void> {
  const { LoginFailure } = await useModels()
  await LoginFailure.destroy({ where: { scope: 'account', key: email } })
}
