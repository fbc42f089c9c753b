/** A one-line progress bar for a terminal: redrawn in place at most ten times a second, then erased. */
export interface ProgressBar {
  tick(done: number): void
  clear(): void
}

export function createProgressBar(stream: {write(s: string): unknown}, total: number, label: string, now = () => Date.now()): ProgressBar {
  let last = -Infinity
  const width = 24
  const draw = (done: number) => {
    const filled = total === 0 ? width : Math.round((done / total) * width)
    stream.write(`\r${label} [${'#'.repeat(filled)}${'-'.repeat(width - filled)}] ${done}/${total}`)
  }
  return {
    tick(done) {
      const t = now()
      if (done < total && t - last < 100) return
      last = t
      draw(done)
    },
    clear() {
      stream.write('\r\u001b[K')
    }
  }
}
