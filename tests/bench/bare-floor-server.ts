// The benchmark's floor: node:http and a bare mysql2 pool doing the least work each answer needs
// (the session row by its key, the person's organisation for a client's scope, then one page
// query and its count, or one case by id), as JSON.
// Started by api-bench.ts with DATABASE_URL and PORT; prints "ready" when listening.
import { createServer, type IncomingMessage } from 'node:http'
import mysql, { type RowDataPacket } from 'mysql2/promise'

const pool = mysql.createPool({ uri: process.env.DATABASE_URL, connectionLimit: 10 })
const PAGE = 25
// STRAIGHT_JOIN: read the cases in index order and look up each one's organisation, the plan
// the least work for a page needs, whatever the optimiser guesses.
const COLUMNS =
  'c.id, c.number, c.title, c.status, c.organisation_id, o.name AS organisation_name, c.component, c.due_date'

function sessionKey(req: IncomingMessage): string {
  const cookie = /fractolog\.sid=s%3A([^.;]+)/.exec(req.headers.cookie ?? '')
  return cookie?.[1] ?? ''
}

async function sessionUser(req: IncomingMessage): Promise<{ user?: number } | undefined> {
  const [rows] = await pool.query<RowDataPacket[]>(
    'SELECT sess FROM sessions WHERE sid = ? AND expired > NOW()',
    [sessionKey(req)],
  )
  const sess = rows[0]?.sess as string | { passport?: { user?: number } } | undefined
  const parsed = typeof sess === 'string' ? JSON.parse(sess) : sess
  return parsed?.passport
}

/** The organisation a client is limited to; null for staff. */
async function scopeOf(userId: number): Promise<number | null> {
  const [rows] = await pool.query<RowDataPacket[]>(
    'SELECT organisation_id FROM users WHERE id = ? AND active = 1',
    [userId],
  )
  return (rows[0]?.organisation_id as number | null | undefined) ?? null
}

function listFilter(
  params: URLSearchParams,
  scope: number | null,
): { where: string; values: unknown[] } {
  const clauses: string[] = []
  const values: unknown[] = []
  if (scope !== null) {
    clauses.push('c.organisation_id = ?')
    values.push(scope)
  }
  const organisation = params.get('organisationId')
  if (organisation) {
    clauses.push('c.organisation_id = ?')
    values.push(Number(organisation))
  }
  const status = params.get('status')
  if (status) {
    clauses.push('c.status = ?')
    values.push(status)
  }
  const q = params.get('q')
  if (q) {
    // the same FULLTEXT index the API's search uses, one prefix word per token
    const words = q.split(/[^\p{L}\p{N}]+/u).filter((word) => word.length >= 3)
    clauses.push(
      'MATCH (c.title, c.component, c.material, c.client_reference) AGAINST (? IN BOOLEAN MODE)',
    )
    values.push(words.map((word) => `+${word}*`).join(' '))
  }
  return { where: clauses.length ? `WHERE ${clauses.join(' AND ')}` : '', values }
}

async function list(params: URLSearchParams, scope: number | null) {
  const { where, values } = listFilter(params, scope)
  const page = Math.max(1, Number(params.get('page') ?? 1))
  const [rows] = await pool.query<RowDataPacket[]>(
    `SELECT ${COLUMNS} FROM cases c STRAIGHT_JOIN organisations o ON o.id = c.organisation_id ${where} ORDER BY c.created_at DESC, c.id DESC LIMIT ${PAGE} OFFSET ${(page - 1) * PAGE}`,
    values,
  )
  const [[count]] = (await pool.query(
    `SELECT COUNT(*) AS total FROM cases c ${where}`,
    values,
  )) as [RowDataPacket[], unknown]
  return { data: rows, page: { page, pageSize: PAGE, total: Number(count?.total ?? 0) } }
}

async function one(id: number, scope: number | null) {
  const [rows] = await pool.query<RowDataPacket[]>(
    `SELECT c.*, o.name AS organisation_name FROM cases c JOIN organisations o ON o.id = c.organisation_id WHERE c.id = ? AND (? IS NULL OR c.organisation_id = ?)`,
    [id, scope, scope],
  )
  return { data: rows[0] }
}

const server = createServer((req, res) => {
  const url = new URL(req.url ?? '/', 'http://floor')
  const answer = async () => {
    const userId = (await sessionUser(req))?.user
    if (!userId) return [401, { error: { code: 'unauthorized' } }] as const
    const scope = await scopeOf(userId)
    const byId = /^\/api\/cases\/(\d+)$/.exec(url.pathname)
    if (byId) return [200, await one(Number(byId[1]), scope)] as const
    return [200, await list(url.searchParams, scope)] as const
  }
  answer().then(
    ([status, body]) => {
      res.writeHead(status, { 'Content-Type': 'application/json' }).end(JSON.stringify(body))
    },
    (error: unknown) => {
      console.error(error)
      res.writeHead(500).end()
    },
  )
})

server.listen(Number(process.env.PORT), '127.0.0.1', () => console.log('ready'))
process.on('SIGTERM', () => server.close(() => void pool.end().then(() => process.exit(0))))
