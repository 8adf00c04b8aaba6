import type { Express } from 'express'
import request from 'supertest'
import { currentCodeFor } from './second-factor-keys'

export type Agent = ReturnType<typeof request.agent>

/** A cookie-keeping client with the current CSRF token, as the browser client behaves. */
export class ApiSession {
  readonly agent: Agent
  token = ''

  constructor(app: Express | string) {
    this.agent = request.agent(app)
  }

  async refreshToken(): Promise<string> {
    const response = await this.agent.get('/api/auth/csrf').expect(200)
    this.token = response.body.data.token as string
    return this.token
  }

  /** Who the server takes this session for: the person's id, or null when signed out. */
  async signedInId(): Promise<number | null> {
    const response = await this.agent.get('/api/auth/me').expect(200)
    return (response.body.data.user?.id as number | undefined) ?? null
  }

  /**
   * Signs in fully, as a person would: the password, then (when the server asks for it) the
   * current code of the person's second factor. Answers the last step's response.
   */
  async signIn(email: string, password: string) {
    await this.refreshToken()
    const response = await this.post('/api/auth/login', { email, password })
    if (response.status !== 200) return response
    await this.refreshToken()
    if (!response.body.data.secondFactorRequired) return response
    const code = await currentCodeFor(email)
    const completed = await this.post('/api/auth/second-factor', { code })
    if (completed.status === 200) await this.refreshToken()
    return completed
  }

  /** Only the password step: the session is then half signed in, awaiting a second factor. */
  async signInWithPasswordOnly(email: string, password: string) {
    await this.refreshToken()
    const response = await this.post('/api/auth/login', { email, password })
    if (response.status === 200) await this.refreshToken()
    return response
  }

  get(path: string) {
    return this.agent.get(path)
  }

  post(path: string, body?: object) {
    return this.agent.post(path).set('X-CSRF-Token', this.token).send(body)
  }

  patch(path: string, body?: object) {
    return this.agent.patch(path).set('X-CSRF-Token', this.token).send(body)
  }

  delete(path: string, body?: object) {
    return this.agent.delete(path).set('X-CSRF-Token', this.token).send(body)
  }

  put(path: string, body?: object) {
    return this.agent.put(path).set('X-CSRF-Token', this.token).send(body)
  }
}

export async function signedIn(app: Express | string, email: string, password: string) {
  const session = new ApiSession(app)
  const response = await session.signIn(email, password)
  if (response.status !== 200) throw new Error(`sign-in failed: ${response.status}`)
  return session
}

/** Signs each person in fully, one after the other, under the same key as in `people`. */
export async function signInAll<Key extends string>(
  app: Express | string,
  people: Record<Key, { email: string; password: string }>,
): Promise<Record<Key, ApiSession>> {
  const sessions = {} as Record<Key, ApiSession>
  for (const key of Object.keys(people) as Key[])
    sessions[key] = await signedIn(app, people[key].email, people[key].password)
  return sessions
}
