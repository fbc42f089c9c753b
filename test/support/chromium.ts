import {existsSync} from 'node:fs'
import {chromium, type Browser} from 'playwright-core'

/** Debian's Chromium, installed by .ci/run with apt; never a downloaded browser build. */
export const chromiumPath = process.env['UPRIGHT_CHROMIUM'] ?? '/usr/bin/chromium'

/**
 * Launch headless Chromium with the flags that keep it off the network on this closed machine
 * (background networking and component updates would otherwise try to reach outside).
 * Throws with a clear message when the browser is missing: a browser test must fail, not skip.
 */
export async function launchChromium(): Promise<Browser> {
  if (!existsSync(chromiumPath)) {
    throw new Error(`Chromium not found at ${chromiumPath}: install Debian's package (apt-get install chromium), as .ci/run does`)
  }
  return chromium.launch({
    executablePath: chromiumPath,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync'
    ]
  })
}
