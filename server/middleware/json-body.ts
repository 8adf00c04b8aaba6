import type { Request } from 'express'

// Request bodies are read with express.json({ strict: false }), so `null`, a number or a string
// arrive here as values and can be refused with words that say what to send instead.

function sentSomething(req: Request): boolean {
  const length = Number(req.headers['content-length'] ?? 0)
  return req.headers['transfer-encoding'] !== undefined || length > 0
}

function describeValue(body: unknown): string {
  if (body === null) return 'null'
  if (Array.isArray(body)) return 'an array'
  return `a ${typeof body}`
}

/**
 * Why the body of this request is not the JSON object a route reads, or undefined when it is one.
 * Each way of missing gets its own words: no body at all, another content type, another JSON value.
 */
export function jsonObjectProblem(req: Request): string | undefined {
  const body: unknown = req.body
  if (body === undefined) {
    if (!sentSomething(req)) return 'The request has no body: send an application/json object.'
    const type = req.headers['content-type'] ?? 'no content type'
    return `The request body must be an application/json object, not ${type}.`
  }
  if (body === null || typeof body !== 'object' || Array.isArray(body)) {
    return `The request body must be an application/json object, not ${describeValue(body)}.`
  }
  return undefined
}
