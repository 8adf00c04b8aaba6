import { Conflict, ValidationError } from '../errors'

interface MysqlError {
  code?: string
  errno?: number
  sqlMessage?: string
}

/** MariaDB's refusals, translated once: duplicate → Conflict, missing reference → Validation. */
export function translateDbError(
  error: unknown,
  duplicateMessage = 'That already exists.',
): unknown {
  const code = (error as MysqlError | null)?.code
  if (code === 'ER_DUP_ENTRY') return new Conflict(duplicateMessage)
  if (code === 'ER_NO_REFERENCED_ROW_2' || code === 'ER_NO_REFERENCED_ROW') {
    return new ValidationError('A referenced record does not exist.')
  }
  return error
}

export async function withDbErrors<T>(
  work: () => Promise<T>,
  duplicateMessage?: string,
): Promise<T> {
  try {
    return await work()
  } catch (error) {
    throw translateDbError(error, duplicateMessage)
  }
}
