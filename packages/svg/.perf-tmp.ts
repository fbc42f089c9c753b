import {handLayout} from './test/support.ts'
import {renderSvg} from './src/index.ts'
for (const n of [100, 1000, 3000, 10000]) {
  const cols = Math.ceil(Math.sqrt(n))
  const ids = Array.from({length: n}, (_, i) => `v${i}`)
  const labels = ids.map((id, i) => (i % 7 === 0 ? `Store ${i}\nannex` : `Store ${i}`))
  const edges: Array<[number, number]> = []
  for (let i = 0; i < n; i++) {
    if (i + cols < n) edges.push([i, i + cols])
    if (i % cols !== cols - 1 && i + cols + 1 < n) edges.push([i, i + cols + 1])
  }
  const h = handLayout(ids, labels, edges, ids.map((_, i) => Math.floor(i / cols)), ids.map((_, i) => i % cols))
  renderSvg(h)
  const c = process.cpuUsage(); const t = performance.now()
  const r = renderSvg(h)
  const cpu = process.cpuUsage(c)
  console.log(n, edges.length, 'wall', (performance.now() - t).toFixed(0), 'ms cpu', ((cpu.user + cpu.system) / 1000).toFixed(0), 'ms', r.svg.length, 'bytes')
}
