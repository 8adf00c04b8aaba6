import type { Server } from 'node:http'
import { createApp } from './app'
import { ConfigError, loadConfig } from './config'
import { resolveDatabase } from './db/database-url'
import { createDb } from './db/knex'
import { migrateLatest } from './db/migrations'
import { demoAccountsNote, seedDemoIfEmpty } from '../seeds/demo'

function listen(app: ReturnType<typeof createApp>, host: string, port: number): Promise<Server> {
  return new Promise((resolveServer, reject) => {
    const server = app.listen(port, host, () => resolveServer(server))
    server.once('error', reject)
  })
}

async function main(): Promise<void> {
  const config = loadConfig()
  const database = await resolveDatabase(config.databaseUrl, 'fractolog')
  const db = createDb(database.url)
  const running: { server?: Server } = {}

  const shutdown = async (signal: string) => {
    console.log(`\n${signal} received, shutting down…`)
    await new Promise((done) => (running.server ? running.server.close(done) : done(undefined)))
    await db.destroy()
    if (database.local) {
      await database.local.stop()
      console.log('Private MariaDB stopped.')
    }
    process.exit(0)
  }
  process.once('SIGINT', () => void shutdown('SIGINT'))
  process.once('SIGTERM', () => void shutdown('SIGTERM'))

  const applied = await migrateLatest(db)
  if (applied.length > 0) console.log(`Applied ${applied.length} migration(s).`)
  if (config.demoData) {
    const options = { password: config.demoPassword, passwordCost: config.passwordCost }
    if (await seedDemoIfEmpty(db, options)) console.log('Demo scenario seeded.')
    console.log(demoAccountsNote(config.demoPassword))
  }
  running.server = await listen(createApp({ db, config }), config.host, config.port)
  console.log(`Fractolog is running at http://${config.host}:${config.port}/`)
}

main().catch((error: unknown) => {
  const message =
    error instanceof ConfigError || error instanceof Error ? error.message : String(error)
  console.error(message)
  process.exit(1)
})
