// Password hashing for code that runs outside Nitro (the seed and scripts/admin.ts). nuxt-auth-utils's
// hashPassword is @adonisjs/hash with its scrypt driver and default options (no `hash.scrypt` in our
// runtime config), so the same driver here writes hashes its verifyPassword accepts, and back.
import { Hash } from '@adonisjs/hash'
import { Scrypt } from '@adonisjs/hash/drivers/scrypt'

let hash: Hash | undefined
function hasher(): Hash {
  hash ??= new Hash(new Scrypt({}))
  return hash
}

export function hashPasswordOffline(password: string): Promise<string> {
  return hasher().make(password)
}

export function verifyPasswordOffline(passwordHash: string, password: string): Promise<boolean> {
  return hasher().verify(passwordHash, password)
}
