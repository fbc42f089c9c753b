// Worker entry when the CLI runs from its TypeScript sources: Node 20 worker threads do not share
// the main thread's loader hooks, so load the worker module through tsx's scoped import here.
const {tsImport} = await import('tsx/esm/api')
const worker = await tsImport('./check-worker.ts', import.meta.url)
export default worker.default
