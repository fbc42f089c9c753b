/**
 * Expand the paths given on the command line into diagram files: Markdown (`.md`) and bare diagram
 * files (`.upright`); directories are searched recursively, skipping dot-folders and node_modules.
 * Sorted, so reports come out in the same order on every machine.
 */
import {readdir, stat} from 'node:fs/promises'
import path from 'node:path'

export interface CollectedFiles {
  files: string[]
  /** Paths that could not be read, with the reason. */
  problems: Array<{path: string; reason: string}>
}

const diagramExtensions = new Set(['.md', '.upright'])

export function isDiagramFile(file: string): boolean {
  return diagramExtensions.has(path.extname(file).toLowerCase())
}

export async function collectFiles(paths: readonly string[], base: string): Promise<CollectedFiles> {
  const files = new Set<string>()
  const problems: CollectedFiles['problems'] = []
  for (const given of paths) {
    const absolute = path.resolve(base, given)
    try {
      const info = await stat(absolute)
      if (info.isDirectory()) await walk(absolute, files)
      else files.add(absolute)
    } catch (error) {
      problems.push({path: given, reason: describeFsError(error)})
    }
  }
  return {files: [...files].sort(), problems}
}

async function walk(dir: string, into: Set<string>): Promise<void> {
  const entries = await readdir(dir, {withFileTypes: true})
  entries.sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : 0))
  for (const entry of entries) {
    if (entry.name.startsWith('.') || entry.name === 'node_modules') continue
    const full = path.join(dir, entry.name)
    if (entry.isDirectory()) await walk(full, into)
    else if (entry.isFile() && isDiagramFile(entry.name)) into.add(full)
  }
}

export function describeFsError(error: unknown): string {
  const code = (error as {code?: string}).code
  if (code === 'ENOENT') return 'no such file or directory'
  if (code === 'EACCES' || code === 'EPERM') return 'permission denied'
  if (code === 'EISDIR') return 'is a directory'
  return error instanceof Error ? error.message : String(error)
}
