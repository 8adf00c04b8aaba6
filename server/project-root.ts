import { existsSync } from 'node:fs'
import { dirname, join } from 'node:path'
import { fileURLToPath } from 'node:url'

/**
 * The folder holding package.json, found by walking up from this module: the same answer from
 * the TypeScript source (server/) and from the compiled bundle (dist-server/).
 */
export function projectRoot(from: string = fileURLToPath(import.meta.url)): string {
  let folder = dirname(from)
  while (!existsSync(join(folder, 'package.json'))) {
    const parent = dirname(folder)
    if (parent === folder) throw new Error(`no package.json above ${from}`)
    folder = parent
  }
  return folder
}
