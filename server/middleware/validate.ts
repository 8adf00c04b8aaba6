import type { RequestHandler } from 'express'
import { z } from 'zod/mini'
import type { FieldIssue } from '../../shared/api/errors'
import { ValidationError } from '../errors'
import { jsonObjectProblem } from './json-body'

type Source = 'body' | 'query' | 'params'

/** Field-by-field messages the client can show next to the inputs. */
export function describeIssues(error: z.core.$ZodError): FieldIssue[] {
  return error.issues.map((issue) => ({ path: issue.path.join('.'), message: issue.message }))
}

export function parseOrThrow<T extends z.core.$ZodType>(
  schema: T,
  value: unknown,
  what: string,
): z.output<T> {
  const result = z.safeParse(schema, value)
  if (!result.success) {
    const details = describeIssues(result.error)
    const first = details[0]
    const where = first?.path ? `${first.path}: ` : ''
    throw new ValidationError(`Invalid ${what}. ${where}${first?.message ?? ''}`.trim(), details)
  }
  return result.data
}

/** Validates one part of the request and stores the parsed value in res.locals[source]. */
export function validate<T extends z.core.$ZodType>(source: Source, schema: T): RequestHandler {
  const what = source === 'body' ? 'request body' : source === 'query' ? 'query' : 'URL'
  return (req, res, next) => {
    const problem = source === 'body' ? jsonObjectProblem(req) : undefined
    if (problem) throw new ValidationError(problem)
    res.locals[source] = parseOrThrow(schema, req[source], what)
    next()
  }
}
