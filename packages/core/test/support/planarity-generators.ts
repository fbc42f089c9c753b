/** Seeded graph generators for planarity tests and the planarity bench. */

export {mulberry32 as prng} from '../../../../test/support/random.ts'

export type Edges = [number, number][]

/** G(n, m)-style random simple graph with m distinct edges (m capped at C(n,2)). */
export function randomGraph(n: number, m: number, rand: () => number): Edges {
  const max = (n * (n - 1)) / 2
  m = Math.min(m, max)
  const seen = new Set<number>()
  const edges: Edges = []
  while (edges.length < m) {
    const u = Math.floor(rand() * n)
    const v = Math.floor(rand() * n)
    if (u === v) continue
    const key = u < v ? u * n + v : v * n + u
    if (seen.has(key)) continue
    seen.add(key)
    edges.push([u, v])
  }
  return edges
}

/**
 * Random maximal planar graph on n >= 3 vertices (3n - 6 edges): start from a triangle, put each new
 * vertex inside a random face and join it to the face's three corners (a random stacked
 * triangulation; every face stays a triangle, so the result is maximal planar). Edge order shuffled.
 */
export function randomMaximalPlanar(n: number, rand: () => number): Edges {
  // Faces as triples; each face is kept in a flat array (two faces for the initial triangle).
  const faces: number[] = [0, 1, 2, 0, 2, 1]
  for (let v = 3; v < n; v++) {
    const f = Math.floor(rand() * (faces.length / 3))
    const a = faces[3 * f]!, b = faces[3 * f + 1]!, c = faces[3 * f + 2]!
    faces[3 * f + 2] = v // (a, b, v)
    faces.push(b, c, v, c, a, v)
  }
  const edges: Edges = []
  const seen = new Set<number>()
  const key = (u: number, v: number): number => (u < v ? u * n + v : v * n + u)
  for (let f = 0; f < faces.length / 3; f++) {
    for (let i = 0; i < 3; i++) {
      const u = faces[3 * f + i]!, v = faces[3 * f + ((i + 1) % 3)]!
      const k = key(u, v)
      if (!seen.has(k)) { seen.add(k); edges.push([u, v]) }
    }
  }
  return shuffle(edges, rand)
}

/** Fisher–Yates, in place; returns its argument. */
export function shuffle<T>(xs: T[], rand: () => number): T[] {
  for (let i = xs.length - 1; i > 0; i--) {
    const j = Math.floor(rand() * (i + 1))
    const t = xs[i]!
    xs[i] = xs[j]!
    xs[j] = t
  }
  return xs
}

/** A random edge between two non-adjacent vertices (assumes one exists). */
export function randomNonEdge(n: number, edges: Edges, rand: () => number): [number, number] {
  const seen = new Set(edges.map(([u, v]) => (u < v ? u * n + v : v * n + u)))
  for (;;) {
    const u = Math.floor(rand() * n), v = Math.floor(rand() * n)
    if (u !== v && !seen.has(u < v ? u * n + v : v * n + u)) return [u, v]
  }
}

/** Relabel vertices at random, shuffle edge order and flip directions at random. */
export function scramble(n: number, edges: Edges, rand: () => number): Edges {
  const perm = shuffle(Array.from({length: n}, (_, i) => i), rand)
  return shuffle(edges.map(([u, v]) => (rand() < 0.5 ? [perm[u]!, perm[v]!] : [perm[v]!, perm[u]!]) as [number, number]), rand)
}
