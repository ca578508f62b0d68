// One-time link tokens: 32 random bytes sent by mail, only their SHA-256 kept in the database.
import { createHash, randomBytes } from 'node:crypto'

export function newToken(): { token: string, tokenHash: string } {
  const token = randomBytes(32).toString('base64url')
  return { token, tokenHash: hashToken(token) }
}

export function hashToken(token: string): string {
  return createHash('sha256').update(token).digest('hex')
}
