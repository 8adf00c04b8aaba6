import { readdirSync, readFileSync, writeFileSync } from 'node:fs'
import { join } from 'node:path'
import { fileURLToPath, URL } from 'node:url'
import { brotliCompressSync, constants, gzipSync } from 'node:zlib'
import { PrimeVueResolver } from '@primevue/auto-import-resolver'
import vue from '@vitejs/plugin-vue'
import Components from 'unplugin-vue-components/vite'
import { defineConfig, type Plugin } from 'vite'

const COMPRESSIBLE = /\.(js|css|html|svg|json|txt)$/

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
    closeBundle: () => {
      const files = readdirSync(outDir, { recursive: true, encoding: 'utf8' })
      for (const file of files.filter(
        (name) => COMPRESSIBLE.test(name) && !name.startsWith('.vite'),
      )) {
        const path = join(outDir, file)
        const bytes = readFileSync(path)
        const brotli = brotliCompressSync(bytes, {
          params: { [constants.BROTLI_PARAM_QUALITY]: constants.BROTLI_MAX_QUALITY },
        })
        const gzip = gzipSync(bytes, { level: 9 })
        if (brotli.length < bytes.length) writeFileSync(`${path}.br`, brotli)
        if (gzip.length < bytes.length) writeFileSync(`${path}.gz`, gzip)
      }
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
