import type { AddressInfo } from 'node:net'
import type { Knex } from 'knex'
import { simpleParser } from 'mailparser'
import { SMTPServer } from 'smtp-server'
import { saveReceivedMail } from './received-mail'

export interface LocalSmtp {
  /** smtp://127.0.0.1:PORT, for SMTP_URL */
  url: string
  port: number
  stop(): Promise<void>
}

const MAX_MESSAGE_BYTES = 10 * 1024 * 1024

function readAll(stream: NodeJS.ReadableStream): Promise<Buffer> {
  return new Promise((done, fail) => {
    const chunks: Buffer[] = []
    stream.on('data', (chunk: Buffer) => chunks.push(chunk))
    stream.on('end', () => done(Buffer.concat(chunks)))
    stream.on('error', fail)
  })
}

/**
 * An SMTP server on loopback for the demo and the tests: it accepts every message and keeps it
 * in `received_mail`. Port 0 (the default) takes a free port, so test runs never collide.
 * A message is acknowledged only once stored, so the sender's "sent" means "kept".
 */
export async function startLocalSmtp(
  db: Knex,
  options: { port?: number; clock?: () => Date } = {},
): Promise<LocalSmtp> {
  const clock = options.clock ?? (() => new Date())
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['AUTH', 'STARTTLS'],
    size: MAX_MESSAGE_BYTES,
    banner: 'Fractolog local mail',
    logger: false,
    onData(stream, _session, callback) {
      readAll(stream)
        .then(async (raw) => saveReceivedMail(db, raw, await simpleParser(raw), clock()))
        .then(
          () => callback(),
          (error: unknown) => callback(error instanceof Error ? error : new Error(String(error))),
        )
    },
  })
  await new Promise<void>((listening, fail) => {
    server.once('error', fail)
    server.listen(options.port ?? 0, '127.0.0.1', () => listening())
  })
  const { port } = server.server.address() as AddressInfo
  return {
    url: `smtp://127.0.0.1:${port}`,
    port,
    stop: () => new Promise<void>((closed) => server.close(() => closed())),
  }
}
