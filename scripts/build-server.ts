// `npm run build:server`: compiles the server and the command line to JavaScript in dist-server/,
// so neither needs a TypeScript loader at run time.
import { build, type BuildOptions } from 'esbuild'

const SERVER_OUT_DIR = 'dist-server'

const common: BuildOptions = {
  bundle: true,
  platform: 'node',
  target: 'node20',
  format: 'esm',
  outdir: SERVER_OUT_DIR,
  logLevel: 'warning',
  // Bundled CommonJS packages may call require(); give the ES module bundle one.
  banner: {
    js: "import { createRequire as __createRequire } from 'node:module'; const require = __createRequire(import.meta.url);",
  },
}

/** The server keeps its packages in node_modules (some have native parts); maps for stack traces. */
const server: BuildOptions = {
  ...common,
  // The tensile analysis and report PDF workers are files of their own beside the server: worker
  // threads load them.
  entryPoints: {
    server: 'server/index.ts',
    'analysis-worker': 'server/tensile/analysis-worker.ts',
    'report-pdf-worker': 'server/services/reports/pdf/worker.ts',
  },
  packages: 'external',
  sourcemap: true,
}

/** The command line carries everything in one file: fewer files to find means a quicker start. */
const commandLine: BuildOptions = {
  ...common,
  entryPoints: { analyze: 'server/cli/analyze.ts' },
  minify: true,
}

await Promise.all([build(server), build(commandLine)])
