import type { Knex } from 'knex'
import { Email } from '../../shared/schemas/auth'
import { z } from 'zod/mini'
import { withDbErrors } from '../db/errors'
import { ValidationError } from '../errors'
import { generateOneTimePassword, hashPassword } from '../auth/passwords'
import { recordSecurityEvent } from './security-events'

const Input = z.strictObject({
  email: Email,
  name: z.string().check(z.trim(), z.minLength(1, 'Give a name.'), z.maxLength(191)),
})

/**
 * An administrator for a real installation, made from the command line: a one-time password
 * that must be replaced at first sign-in (and a second factor set up then), valid `hours` hours.
 */
export async function createAdministrator(
  db: Knex,
  given: { email: string; name: string },
  options: { passwordCost: number; hours: number },
): Promise<{ id: number; oneTimePassword: string }> {
  const parsed = z.safeParse(Input, given)
  if (!parsed.success) throw new ValidationError(parsed.error.issues[0]?.message ?? 'Bad input.')
  const { email, name } = parsed.data
  const oneTimePassword = generateOneTimePassword()
  const passwordHash = await hashPassword(oneTimePassword, options.passwordCost)
  const expires = new Date(Date.now() + options.hours * 3_600_000)
  const id = await withDbErrors(
    () =>
      db.transaction(async (trx) => {
        const [newId] = (await trx('users').insert({
          email,
          name,
          passwordHash,
          mustChangePassword: true,
          oneTimePasswordExpiresAt: expires,
        })) as number[]
        await trx('user_roles').insert({ userId: newId, role: 'admin' })
        const trail = { actorId: null, address: null, userAgent: 'npm run create-admin' }
        const details = { personId: newId, roles: ['admin'], via: 'create-admin' }
        await recordSecurityEvent(trx, trail, { kind: 'person.created', email, details })
        return newId as number
      }),
    { index: 'users_email_unique', message: 'A person with this e-mail address already exists.' },
  )
  return { id, oneTimePassword }
}
