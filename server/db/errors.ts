import { Conflict, ValidationError } from '../errors'

interface MysqlError {
  code?: string
  errno?: number
  sqlMessage?: string
}

/** The words for a duplicate on one unique index (its name as the migration made it). */
export interface DuplicateOf {
  index: string
  message: string
}

const GENERIC_DUPLICATE = 'That already exists.'

function duplicateMessage(error: MysqlError, duplicate: string | DuplicateOf | undefined): string {
  if (duplicate === undefined || typeof duplicate === 'string')
    return duplicate ?? GENERIC_DUPLICATE
  // MariaDB: "Duplicate entry 'x' for key 'users_email_unique'"
  const onIndex = (error.sqlMessage ?? '').endsWith(`'${duplicate.index}'`)
  return onIndex ? duplicate.message : GENERIC_DUPLICATE
}

/** MariaDB's refusals, translated once: duplicate → Conflict, missing reference → Validation. */
export function translateDbError(error: unknown, duplicate?: string | DuplicateOf): unknown {
  const code = (error as MysqlError | null)?.code
  if (code === 'ER_DUP_ENTRY') return new Conflict(duplicateMessage(error as MysqlError, duplicate))
  if (code === 'ER_NO_REFERENCED_ROW_2' || code === 'ER_NO_REFERENCED_ROW') {
    return new ValidationError('A referenced record does not exist.')
  }
  return error
}

export async function withDbErrors<T>(
  work: () => Promise<T>,
  duplicate?: string | DuplicateOf,
): Promise<T> {
  try {
    return await work()
  } catch (error) {
    throw translateDbError(error, duplicate)
  }
}
