/**
 * `upright check|…` — the command line. Only this package touches the file system and the process;
 * `run` takes its world as an argument so tests can drive it in-process.
 */
import {Command, CommanderError, InvalidArgumentError, Option} from 'commander'
import {flows, type Flow} from '@upright/core'
import {collectFiles} from './collect-files.ts'
import {checkFile, type FileReport} from './check-files.ts'
import {toJsonReport} from './format-json.ts'
import {formatText, summarize} from './format-text.ts'

export interface Io {
  cwd: string
  env: Readonly<Record<string, string | undefined>>
  stdout: {write(s: string): unknown; isTTY?: boolean | undefined}
  stderr: {write(s: string): unknown; isTTY?: boolean | undefined}
}

export const exitCodes = {ok: 0, failed: 1, usage: 2} as const

export async function run(argv: readonly string[], io: Io): Promise<number> {
  let exit: number = exitCodes.ok
  const program = new Command()
    .name('upright')
    .description('Check and draw upward planar diagrams written in Markdown.')
    .exitOverride()
    .configureOutput({
      writeOut: (s) => io.stdout.write(s),
      writeErr: (s) => io.stderr.write(s)
    })

  program
    .command('check')
    .description('check every upright diagram in the given Markdown (.md) and diagram (.upright) files and folders')
    .argument('<paths...>', 'files or folders')
    .addOption(new Option('--format <format>', 'report format').choices(['text', 'json']).default('text'))
    .addOption(new Option('--flow <flow>', 'default flow (for .upright files: their flow)').choices(flows))
    .option('--title <title>', 'title (for .upright files)')
    .option('--budget <ms>', 'milliseconds the upward test may spend per diagram', parseBudget)
    .action(async (paths: string[], opts: {format: 'text' | 'json'; flow?: Flow; title?: string; budget?: number}) => {
      exit = await check(paths, opts, io)
    })

  try {
    await program.parseAsync([...argv], {from: 'user'})
  } catch (error) {
    if (error instanceof CommanderError) {
      // Help and version print and exit 0; every other commander error is a usage error.
      return error.exitCode === 0 ? exitCodes.ok : exitCodes.usage
    }
    throw error
  }
  return exit
}

function parseBudget(value: string): number {
  const n = Number(value)
  if (!Number.isFinite(n) || n <= 0) throw new InvalidArgumentError('expected a positive number of milliseconds')
  return n
}

/** Where relative paths start: where the user typed the command, also under `pnpm upright`. */
export function baseDirectory(io: Io): string {
  return io.env['npm_lifecycle_event'] === 'upright' && io.env['INIT_CWD'] ? io.env['INIT_CWD'] : io.cwd
}

async function check(
  paths: string[],
  opts: {format: 'text' | 'json'; flow?: Flow; title?: string; budget?: number},
  io: Io
): Promise<number> {
  const base = baseDirectory(io)
  const collected = await collectFiles(paths, base)
  for (const p of collected.problems) io.stderr.write(`upright: cannot read ${p.path}: ${p.reason}\n`)
  const showProgress = Boolean(io.stderr.isTTY) && collected.files.length > 20
  const reports: FileReport[] = []
  for (const [i, file] of collected.files.entries()) {
    if (showProgress) io.stderr.write(`\rchecking ${i + 1}/${collected.files.length}`)
    reports.push(await checkFile(file, {base, flow: opts.flow, title: opts.title, budget: opts.budget}))
  }
  if (showProgress) io.stderr.write('\r\u001b[K')

  if (opts.format === 'json') {
    io.stdout.write(JSON.stringify(toJsonReport(reports), null, 2) + '\n')
  } else {
    const colour = Boolean(io.stdout.isTTY) && io.env['NO_COLOR'] === undefined
    io.stdout.write(formatText(reports, {colour}))
  }
  const summary = summarize(reports)
  if (collected.problems.length > 0 || summary.unreadable > 0) return exitCodes.usage
  return summary.failed > 0 ? exitCodes.failed : exitCodes.ok
}
