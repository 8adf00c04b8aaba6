// `npm start`: build the client, then run the server in this same process, so a signal sent to
// npm (Ctrl-C, SIGTERM) reaches the server and it can stop the MariaDB it started.
import { runStep } from './run-step'

const code = await runStep('npx', ['vite', 'build', '--logLevel', 'warn'])
if (code !== 0) {
  console.error('The client build failed; not starting.')
  process.exit(code)
}
await import('../server/index')
