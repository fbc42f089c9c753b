/**
 * A file's report in a form that crosses a worker-thread boundary (structured clone): no syntax-tree
 * nodes, no functions. Everything the text and JSON formats read survives; the block keeps its
 * positions and body, and its position map, which has done its work, is gone.
 */
import type {BlockResult, DiagramBlock} from 'remark-upright'
import {threadId} from 'node:worker_threads'
import type {FileReport} from './check-files.ts'

export interface PortableResult {
  block: Pick<DiagramBlock, 'form' | 'body' | 'start' | 'end'>
  options: BlockResult['options']
  status: BlockResult['status']
  messages: BlockResult['messages']
  certificate: BlockResult['certificate']
}

export interface PortableReport {
  file: string
  display: string
  text: string
  results: PortableResult[]
  error?: string
  /** The worker thread that checked the file (0: the main thread). */
  thread: number
}

export function toPortable(report: FileReport): PortableReport {
  const out: PortableReport = {
    thread: threadId,
    file: report.file,
    display: report.display,
    text: report.text,
    results: report.results.map(toPortableResult)
  }
  if (report.error !== undefined) out.error = report.error
  return out
}

export function toPortableResult(r: BlockResult): PortableResult {
  return {
    block: {form: r.block.form, body: r.block.body, start: r.block.start, end: r.block.end},
    options: r.options,
    status: r.status,
    messages: r.messages,
    certificate: r.certificate ?? r.check?.certificate
  }
}

export function fromPortable(report: PortableReport): FileReport {
  const out: FileReport = {
    file: report.file,
    display: report.display,
    text: report.text,
    results: report.results.map(fromPortableResult)
  }
  if (report.error !== undefined) out.error = report.error
  return out
}

export function fromPortableResult(r: PortableResult): BlockResult {
  return {
    block: {
      ...r.block,
      parent: {type: 'root', children: []},
      nodes: [],
      meta: undefined,
      toFile: () => {
        throw new Error('this block was checked elsewhere (another thread, or an earlier run); its messages are already in file positions')
      }
    },
    options: r.options,
    check: undefined,
    status: r.status,
    messages: r.messages,
    certificate: r.certificate
  }
}
