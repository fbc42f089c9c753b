/**
 * One worker thread of `upright check`: checks the files it is handed with the same code as the
 * single-threaded path, through its own view of the shared cache folder (writes are atomic, so
 * threads and processes can share it).
 */
import {openOutcomeCache} from 'remark-upright/check'
import {checkFile, type CheckFilesOptions} from './check-files.ts'
import {toPortable, type PortableReport} from './portable-report.ts'

export interface CheckTask {
  file: string
  options: Omit<CheckFilesOptions, 'cache'>
  /** The cache setting, resolved by the main thread: a folder, memory only, or none. */
  cache: {dir: string} | boolean
}

export default async function checkTask(task: CheckTask): Promise<PortableReport> {
  const cache = openOutcomeCache(task.cache, task.options.base)
  return toPortable(await checkFile(task.file, {...task.options, cache}))
}
