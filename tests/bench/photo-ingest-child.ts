import { mkdtempSync, readFileSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { createApp } from '../../server/app'
import { createDb } from '../../server/db/knex'
import { dropAllTables, migrateLatest } from '../../server/db/migrations'
import { createLocalStorage } from '../../server/storage/local-storage'
import { makeCase, makeOrganisation, makePerson } from '../factories'
import { signedIn } from '../helpers/api-session'
import { testConfig } from '../helpers/test-config'

/*
 * Run by photo-bench.ts in its own process, so its peak resident memory is the server's: ten
 * uploads of the same large JPEG at once through the whole HTTP app, on its own database.
 */
const [file, url] = [process.argv[2] as string, process.env.BENCH_DATABASE_URL as string]
const db = createDb(url)
const uploads = mkdtempSync(join(tmpdir(), 'fractolog-bench-'))
try {
  await dropAllTables(db)
  await migrateLatest(db)
  const storage = createLocalStorage(uploads)
  const config = testConfig()
  const app = createApp({ db, config, storage, incomingDir: join(uploads, 'incoming') })
  const lead = await makePerson(db, ['investigator'])
  const organisation = await makeOrganisation(db)
  const { id } = await makeCase(db, organisation, lead.id, { leadInvestigatorId: lead.id })
  const session = await signedIn(app, lead.email, lead.password)
  const bytes = readFileSync(file)
  const start = performance.now()
  const answers = await Promise.all(
    Array.from({ length: 10 }, (_, i) =>
      session.agent
        .post(`/api/cases/${id}/photos`)
        .set('X-CSRF-Token', session.token)
        .attach('file', bytes, `large-${i}.jpg`),
    ),
  )
  const statuses = answers.map((answer) => answer.status)
  if (statuses.some((status) => status !== 201)) throw new Error(`uploads answered ${statuses}`)
  process.stdout.write(`ten-uploads-ms ${Math.round(performance.now() - start)}\n`)
} finally {
  await db.destroy()
  rmSync(uploads, { recursive: true, force: true })
}
