import { existsSync, readFileSync } from 'node:fs'
import { join, resolve } from 'node:path'
import { gzipSync } from 'node:zlib'

/*
 * What the browser loads for each page of the built client, read from Vite's manifest: the
 * entry with its static imports, plus the page's lazy chunk with its static imports (Vite
 * preloads those together). Sizes count each file gzipped at level 9.
 */

export const CLIENT_DIR = resolve(import.meta.dirname, '../../dist')
const ROUTER_SOURCE = resolve(import.meta.dirname, '../../src/router/index.ts')

/** The first-visit budget: sign-in, then the case list (bytes, each file gzipped at level 9). */
export const FIRST_VISIT_BUDGET = 150_000

interface ManifestChunk {
  file: string
  name?: string
  src?: string
  isEntry?: boolean
  imports?: string[]
  dynamicImports?: string[]
}
export type Manifest = Record<string, ManifestChunk>

export function readManifest(clientDir = CLIENT_DIR): Manifest {
  const path = join(clientDir, '.vite/manifest.json')
  if (!existsSync(path)) throw new Error(`${path} is missing: build the client (npm run build)`)
  return JSON.parse(readFileSync(path, 'utf8')) as Manifest
}

function entryKey(manifest: Manifest): string {
  const key = Object.keys(manifest).find((name) => manifest[name]?.isEntry)
  if (!key) throw new Error('the manifest names no entry')
  return key
}

function staticFiles(manifest: Manifest, key: string, into: Set<string>): Set<string> {
  const chunk = manifest[key]
  if (!chunk) throw new Error(`the manifest has no chunk ${key}`)
  if (into.has(chunk.file)) return into
  into.add(chunk.file)
  for (const imported of chunk.imports ?? []) staticFiles(manifest, imported, into)
  return into
}

/** Files (paths under the client folder) the app itself loads before any page. */
export function entryFiles(manifest: Manifest): string[] {
  return [...staticFiles(manifest, entryKey(manifest), new Set())]
}

/** A view also imported statically elsewhere is keyed by its chunk's name, not its source. */
function viewKey(manifest: Manifest, viewSource: string): string {
  if (manifest[viewSource]) return viewSource
  const name = viewSource.replace(/^.*\//, '').replace(/\.vue$/, '')
  return Object.keys(manifest).find((key) => manifest[key]?.name === name) ?? viewSource
}

/** Files a page loads: the entry's, then the view's chunk and what it imports. */
export function pageFiles(manifest: Manifest, viewSource: string): string[] {
  const files = staticFiles(manifest, entryKey(manifest), new Set())
  return [...staticFiles(manifest, viewKey(manifest, viewSource), files)]
}

/** Files of several pages visited one after the other in one tab. */
export function journeyFiles(manifest: Manifest, viewSources: string[]): string[] {
  return [...new Set(viewSources.flatMap((source) => pageFiles(manifest, source)))].sort()
}

const gzipCache = new Map<string, number>()

export function gzipSize(file: string, clientDir = CLIENT_DIR): number {
  const path = join(clientDir, file)
  let size = gzipCache.get(path)
  if (size === undefined) {
    size = gzipSync(readFileSync(path), { level: 9 }).length
    gzipCache.set(path, size)
  }
  return size
}

export function totalGzipSize(files: string[], clientDir = CLIENT_DIR): number {
  return files.reduce((sum, file) => sum + gzipSize(file, clientDir), 0)
}

export interface RouteView {
  path: string
  /** the view's source as the manifest names it, e.g. src/views/SignInView.vue */
  source: string
}

/** The routes with a lazily loaded view, read from the router's table. */
export function routeViews(routerSource = readFileSync(ROUTER_SOURCE, 'utf8')): RouteView[] {
  const route = /path: '([^']*)'[^{}]*?import\('@\/views\/([\w/]+\.vue)'\)/g
  return [...routerSource.matchAll(route)].map(([, path, view]) => ({
    path: path ?? '',
    source: `src/views/${view}`,
  }))
}

/** The view shown at a path, by the router's table. */
export function viewAt(path: string, routes = routeViews()): string {
  const route = routes.find((candidate) => candidate.path === path)
  if (!route) throw new Error(`no lazily loaded view at ${path}`)
  return route.source
}
