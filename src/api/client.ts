/** An error answer from the API: `{ error: { code, message, details } }` with its HTTP status. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: unknown,
  ) {
    super(message)
  }

  /** Field messages from a validation error, keyed by the field path. */
  fieldMessages(): Record<string, string> {
    if (!Array.isArray(this.details)) return {}
    const entries = (this.details as { path?: string; message?: string }[])
      .filter((item) => item.path && item.message)
      .map((item) => [item.path as string, item.message as string])
    return Object.fromEntries(entries)
  }
}

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE'

export interface RequestOptions {
  query?: Record<string, string | number | undefined>
  body?: unknown
  headers?: Record<string, string>
}

function withQuery(path: string, query: RequestOptions['query']): string {
  if (!query) return path
  const params = new URLSearchParams()
  for (const [key, value] of Object.entries(query)) {
    if (value !== undefined && value !== '') params.set(key, String(value))
  }
  const text = params.toString()
  return text ? `${path}?${text}` : path
}

async function toApiError(response: Response): Promise<ApiError> {
  const body = (await response.json().catch(() => undefined)) as
    { error?: { code?: string; message?: string; details?: unknown } } | undefined
  const error = body?.error
  return new ApiError(
    response.status,
    error?.code ?? 'http_error',
    error?.message ?? `The server answered ${response.status}.`,
    error?.details,
  )
}

/** The one place that talks HTTP to the API; every resource module goes through it. */
export async function request<T>(
  method: Method,
  path: string,
  options: RequestOptions = {},
): Promise<T> {
  const headers: Record<string, string> = { Accept: 'application/json', ...options.headers }
  if (options.body !== undefined) headers['Content-Type'] = 'application/json'
  let response: Response
  try {
    response = await fetch(withQuery(`/api${path}`, options.query), {
      method,
      headers,
      credentials: 'same-origin',
      body: options.body === undefined ? undefined : JSON.stringify(options.body),
    })
  } catch {
    throw new ApiError(0, 'network_error', 'The server cannot be reached. Check the connection.')
  }
  if (!response.ok) throw await toApiError(response)
  if (response.status === 204) return undefined as T
  return (await response.json()) as T
}
