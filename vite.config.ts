import { readdirSync } from 'node:fs'
import { readFile, writeFile } from 'node:fs/promises'
import { join } from 'node:path'
import { fileURLToPath, URL } from 'node:url'
import { promisify } from 'node:util'
import { brotliCompress, constants, gzip as gzipCompress } from 'node:zlib'
import { PrimeVueResolver } from '@primevue/auto-import-resolver'
import vue from '@vitejs/plugin-vue'
import Components from 'unplugin-vue-components/vite'
import { defineConfig, type Plugin } from 'vite'

const COMPRESSIBLE = /\.(js|css|html|svg|json|txt)$/
const brotli = promisify(brotliCompress)
const gzip = promisify(gzipCompress)

async function writeCompressedCopies(path: string): Promise<void> {
  const bytes = await readFile(path)
  const [smallest, gzipped] = await Promise.all([
    brotli(bytes, { params: { [constants.BROTLI_PARAM_QUALITY]: constants.BROTLI_MAX_QUALITY } }),
    gzip(bytes, { level: 9 }),
  ])
  if (smallest.length < bytes.length) await writeFile(`${path}.br`, smallest)
  if (gzipped.length < bytes.length) await writeFile(`${path}.gz`, gzipped)
}

/**
 * Writes a brotli (.br, strongest setting) and a gzip (.gz, level 9) copy beside every text file
 * of the build, so the server sends compressed bytes without compressing on each request.
 */
function precompress(): Plugin {
  let outDir = 'dist'
  return {
    name: 'fractolog-precompress',
    apply: 'build',
    configResolved: (config) => {
      outDir = config.build.outDir
    },
    closeBundle: async () => {
      const files = readdirSync(outDir, { recursive: true, encoding: 'utf8' })
      const served = files.filter((name) => COMPRESSIBLE.test(name) && !name.startsWith('.vite'))
      await Promise.all(served.map((file) => writeCompressedCopies(join(outDir, file))))
    },
  }
}

export default defineConfig({
  plugins: [
    vue(),
    // PrimeVue components are imported per use, so each lazy route carries only what it shows.
    Components({ resolvers: [PrimeVueResolver()], dts: 'src/components.d.ts' }),
    precompress(),
  ],
  resolve: {
    alias: { '@': fileURLToPath(new URL('./src', import.meta.url)) },
  },
  server: {
    host: '127.0.0.1',
    proxy: { '/api': 'http://127.0.0.1:3000' },
  },
  build: {
    outDir: 'dist',
    // .vite/manifest.json: which files each route loads, read by the bundle budget check
    manifest: true,
    chunkSizeWarningLimit: 600,
    // Fonts stay files, never data: URIs, so the content security policy can keep font-src 'self'.
    assetsInlineLimit: (file: string) => (/\.woff2?$/.test(file) ? false : undefined),
  },
})
