import type { AddressInfo } from 'node:net'
import { createServer, type Server } from 'node:http'
import { describe, expect, it } from 'vitest'
import { gracefulShutdown } from '../../server/lifecycle/shutdown'
import { createTestDb } from '../helpers/test-db'

/** A server whose one route answers after `delayMs`, counting the answers it finished. */
async function slowServer(delayMs: number) {
  const finished: number[] = []
  const server: Server = createServer((_req, res) => {
    setTimeout(() => {
      res.end('done')
      finished.push(Date.now())
    }, delayMs)
  })
  await new Promise<void>((listening) => server.listen(0, '127.0.0.1', listening))
  const url = `http://127.0.0.1:${(server.address() as AddressInfo).port}/`
  return { server, url, finished }
}

/** A request on a keep-alive connection, as browsers make them; answers its body or the error. */
async function ask(url: string): Promise<string> {
  try {
    const response = await fetch(url, { signal: AbortSignal.timeout(20_000) })
    return await response.text()
  } catch (error) {
    return `failed: ${(error as Error).message}`
  }
}

const pause = (ms: number) => new Promise((done) => setTimeout(done, ms))

describe('graceful shutdown', () => {
  it('finishes requests in flight, then closes the pool, then stops MariaDB, in that order', async () => {
    const { server, url, finished } = await slowServer(600)
    const db = createTestDb()
    await db.raw('SELECT 1')
    await ask(url) // leaves an idle keep-alive connection behind
    const inFlight = ask(url)
    await pause(100)
    const order: string[] = []
    let poolWasClosed = false
    const started = Date.now()
    const shutdown = gracefulShutdown({
      server,
      db,
      log: () => undefined,
      stopDatabase: async () => {
        order.push(`stop MariaDB after ${finished.length} answers`)
        poolWasClosed = await db.raw('SELECT 1').then(
          () => false,
          () => true,
        )
      },
    })
    await pause(50)
    expect(await ask(url)).toMatch(/^failed/) // no longer accepting
    expect(await inFlight).toBe('done')
    await shutdown
    expect(order).toEqual(['stop MariaDB after 2 answers'])
    expect(poolWasClosed).toBe(true)
    // well before the 5 s an idle keep-alive connection would otherwise hold the server open
    expect(Date.now() - started).toBeLessThan(2_000)
  })

  it('cuts off a request that outlasts the grace period, and still stops everything', async () => {
    const { server, url } = await slowServer(30_000)
    const db = createTestDb()
    const inFlight = ask(url)
    await pause(100)
    let stopped = false
    const started = Date.now()
    await gracefulShutdown({
      server,
      db,
      graceMs: 300,
      log: () => undefined,
      stopDatabase: async () => {
        stopped = true
      },
    })
    expect(Date.now() - started).toBeLessThan(2_000)
    expect(await inFlight).toMatch(/^failed/)
    expect(stopped).toBe(true)
  })
})
