/** Drive `upright` in-process with captured output, as a user at `cwd` would. */
import {run} from '@upright/cli'

export async function cli(args: string[], cwd: string, tty = false) {
  let stdout = ''
  let stderr = ''
  const code = await run(args, {
    cwd,
    env: {},
    stdout: {write: (s: string) => (stdout += s)},
    stderr: {write: (s: string) => (stderr += s), isTTY: tty}
  })
  return {code, stdout, stderr}
}
