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
  /** a multipart body (file uploads); the browser sets its content type */
  form?: FormData
  headers?: Record<string, string>
  /** hears how much of a multipart body was sent (0…1); the request then goes by XHR */
  onUploadProgress?: (share: number) => void
}

/** Whether an error means the session is gone or may do nothing before a password change. */
export function isSessionProblem(error: unknown): boolean {
  return (
    error instanceof ApiError &&
    ((error.status === 401 && error.code === 'unauthenticated') ||
      (error.status === 403 &&
        (error.code === 'password_change_required' ||
          error.code === 'second_factor_setup_required')))
  )
}

type SessionProblemListener = (error: ApiError, path: string) => void
let sessionProblemListener: SessionProblemListener | undefined

/** Lets the app react in one place (go to sign-in, go to set-password) to a session problem. */
export function onSessionProblem(listener: SessionProblemListener): void {
  sessionProblemListener = listener
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

/** fetch cannot report upload progress; XHR can, and its answer is wrapped as a Response. */
function sendWithProgress(
  url: string,
  init: { method: Method; headers: Record<string, string>; body?: FormData },
  onProgress: (share: number) => void,
): Promise<Response> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest()
    xhr.open(init.method, url)
    for (const [name, value] of Object.entries(init.headers)) xhr.setRequestHeader(name, value)
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable) onProgress(event.loaded / event.total)
    }
    xhr.onerror = () => reject(new TypeError('network error'))
    xhr.onload = () => {
      const headers = { 'Content-Type': xhr.getResponseHeader('Content-Type') ?? 'text/plain' }
      const body = xhr.status === 204 ? null : xhr.responseText
      resolve(new Response(body, { status: xhr.status, headers }))
    }
    xhr.send(init.body)
  })
}

async function send(method: Method, path: string, options: RequestOptions, csrfToken?: string) {
  const headers: Record<string, string> = { Accept: 'application/json', ...options.headers }
  if (options.body !== undefined && !options.form) headers['Content-Type'] = 'application/json'
  if (csrfToken) headers['X-CSRF-Token'] = csrfToken
  const url = withQuery(`/api${path}`, options.query)
  try {
    if (options.onUploadProgress && options.form) {
      return await sendWithProgress(
        url,
        { method, headers, body: options.form },
        options.onUploadProgress,
      )
    }
    return await fetch(url, {
      method,
      headers,
      credentials: 'same-origin',
      body: options.form ?? (options.body === undefined ? undefined : JSON.stringify(options.body)),
    })
  } catch {
    throw new ApiError(0, 'network_error', 'The server cannot be reached. Check the connection.')
  }
}

async function readBody<T>(response: Response): Promise<T> {
  if (!response.ok) throw await toApiError(response)
  if (response.status === 204) return undefined as T
  return (await response.json()) as T
}

// The CSRF token belongs to the session: it is fetched at start and again whenever the session
// changes (sign-in, sign-out), and kept here so every changing request can send it.
let csrfToken: string | undefined
let pendingCsrfToken: Promise<string> | undefined

/** Fetches a fresh CSRF token for the current session and keeps it for later requests. */
export function refreshCsrfToken(): Promise<string> {
  pendingCsrfToken ??= send('GET', '/auth/csrf', {})
    .then((response) => readBody<{ data: { token: string } }>(response))
    .then(({ data }) => {
      csrfToken = data.token
      return data.token
    })
    .finally(() => {
      pendingCsrfToken = undefined
    })
  return pendingCsrfToken
}

async function sendWithCsrf(method: Method, path: string, options: RequestOptions) {
  const token = csrfToken ?? (await refreshCsrfToken())
  const response = await send(method, path, options, token)
  if (response.status !== 403) return response
  const error = await toApiError(response.clone())
  if (error.code !== 'csrf_invalid') return response
  // The session may have changed in another tab since the token was fetched: try once more.
  return send(method, path, options, await refreshCsrfToken())
}

/** The one place that talks HTTP to the API; every resource module goes through it. */
export async function request<T>(
  method: Method,
  path: string,
  options: RequestOptions = {},
): Promise<T> {
  const response =
    method === 'GET' ? await send(method, path, options) : await sendWithCsrf(method, path, options)
  try {
    return await readBody<T>(response)
  } catch (error) {
    if (error instanceof ApiError && isSessionProblem(error)) sessionProblemListener?.(error, path)
    throw error
  }
}
