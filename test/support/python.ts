import {spawnSync} from 'node:child_process'

/**
 * Run a python3 snippet with JSON on stdin and parse the JSON it prints. Used to ask networkx (a
 * general-purpose reference library) about the same graphs our code decides, in one process per batch.
 */
export function runPythonJson<T>(script: string, input: unknown): T {
  const result = spawnSync('python3', ['-c', script], {
    input: JSON.stringify(input),
    encoding: 'utf8',
    maxBuffer: 1 << 30
  })
  if (result.status !== 0) {
    throw new Error(`python3 failed (${result.status}): ${result.stderr}`)
  }
  return JSON.parse(result.stdout) as T
}
