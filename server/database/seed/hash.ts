// The same scrypt hashing that nuxt-auth-utils uses on the server
// (@adonisjs/hash with its scrypt driver and default options), for scripts
// that run outside Nitro.
import { createHash } from 'node:crypto'
import { Hash } from '@adonisjs/hash'
import { Scrypt } from '@adonisjs/hash/drivers/scrypt'

const hasher = new Hash(new Scrypt({}))

export const hashUserPassword = (password: string) => hasher.make(password)

export const sha256 = (text: string) => createHash('sha256').update(text).digest('hex')
