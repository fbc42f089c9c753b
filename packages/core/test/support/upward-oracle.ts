/**
 * Brute-force upward planarity, for tests only; shares no code with packages/core/src.
 *
 * A digraph is upward planar iff it is acyclic and each connected component has a planar, bimodal
 * rotation system, an outer face and an assignment of every source and sink to one of its switch
 * angles such that each inner face with 2·n_f switch angles gets n_f − 1 of them and the outer face
 * n_f + 1 (Bertolazzi, Di Battista, Liotta & Mannino, Algorithmica 12, 1994; angles rather than
 * faces, see /work/shared/UPWARD-FACTS.md). Here every piece is done by exhaustion:
 * - rotation systems: at each vertex every cyclic order in which the incoming edges are contiguous
 *   (the bimodal ones; the same set as filtering all (deg − 1)! orders), in all combinations;
 * - planarity: V − E + F = 2 with faces traced directly (Mohar & Thomassen 2001; common practice);
 * - the assignment: a backtracking search over each source's and sink's faces, not a flow.
 * Exponential; a cap on the number of rotation systems guards the cost.
 */

export type Edge = readonly [number, number]

export interface OracleOptions {
  /** Most rotation systems tried per component before giving up with a RangeError. Default 3e6. */
  cap?: number
}

export interface ComponentWitness {
  vertices: number[]
  /** Rotation per vertex of the component (edge ids of the input), clockwise. */
  rotation: Map<number, number[]>
  /** A dart (2e tail->head, 2e+1 head->tail) of the outer face. */
  outerDart: number
  /** Per source/sink of the component: the dart entering it that names its large angle. */
  largeAngle: Map<number, number>
}

export type OracleResult = {upward: true; witness: ComponentWitness[]} | {upward: false; why: 'cyclic' | 'no-embedding'}

export function isUpwardPlanarBruteForce(n: number, edges: readonly Edge[], options?: OracleOptions): boolean {
  return upwardPlanarBruteForce(n, edges, options).upward
}

export function upwardPlanarBruteForce(n: number, edges: readonly Edge[], options?: OracleOptions): OracleResult {
  const cap = options?.cap ?? 3e6
  if (!isAcyclic(n, edges)) return {upward: false, why: 'cyclic'}
  const witness: ComponentWitness[] = []
  for (const comp of componentsOf(n, edges)) {
    const found = searchComponent(edges, comp, cap)
    if (found === null) return {upward: false, why: 'no-embedding'}
    witness.push(found)
  }
  return {upward: true, witness}
}

/** Kahn's algorithm (common practice). */
export function isAcyclic(n: number, edges: readonly Edge[]): boolean {
  const indeg = new Array<number>(n).fill(0)
  const out: number[][] = Array.from({length: n}, () => [])
  for (const [u, v] of edges) {
    indeg[v]!++
    out[u]!.push(v)
  }
  const queue = indeg.flatMap((d, v) => (d === 0 ? [v] : []))
  let seen = 0
  while (queue.length > 0) {
    const v = queue.pop()!
    seen++
    for (const w of out[v]!) if (--indeg[w]! === 0) queue.push(w)
  }
  return seen === n
}

/** Components with at least one edge: vertex lists and edge ids. */
function componentsOf(n: number, edges: readonly Edge[]): Array<{vertices: number[]; edges: number[]}> {
  const parent = Array.from({length: n}, (_, i) => i)
  const find = (x: number): number => (parent[x] === x ? x : (parent[x] = find(parent[x]!)))
  for (const [u, v] of edges) parent[find(u)] = find(v)
  const byRoot = new Map<number, {vertices: number[]; edges: number[]}>()
  edges.forEach(([u], e) => {
    const r = find(u)
    if (!byRoot.has(r)) byRoot.set(r, {vertices: [], edges: []})
    byRoot.get(r)!.edges.push(e)
  })
  for (let v = 0; v < n; v++) byRoot.get(find(v))?.vertices.push(v)
  return [...byRoot.values()]
}

function permutations(xs: number[]): number[][] {
  if (xs.length <= 1) return [xs.slice()]
  const out: number[][] = []
  xs.forEach((x, i) => {
    for (const rest of permutations([...xs.slice(0, i), ...xs.slice(i + 1)])) out.push([x, ...rest])
  })
  return out
}

/** Every bimodal cyclic order of v's edges, each once: the in-block first, then the out-block. */
export function bimodalOrders(ins: number[], outs: number[]): number[][] {
  if (ins.length === 0 || outs.length === 0) {
    const all = ins.length === 0 ? outs : ins
    if (all.length === 0) return [[]]
    return permutations(all.slice(1)).map((p) => [all[0]!, ...p])
  }
  const out: number[][] = []
  for (const a of permutations(ins)) for (const b of permutations(outs)) out.push([...a, ...b])
  return out
}

function searchComponent(edges: readonly Edge[], comp: {vertices: number[]; edges: number[]}, cap: number): ComponentWitness | null {
  const {vertices} = comp
  const choices = vertices.map((v) =>
    bimodalOrders(
      comp.edges.filter((e) => edges[e]![1] === v),
      comp.edges.filter((e) => edges[e]![0] === v)
    )
  )
  const total = choices.reduce((p, c) => p * c.length, 1)
  if (total > cap) throw new RangeError(`oracle: ${total} rotation systems exceed the cap ${cap}`)
  const idx = new Array<number>(vertices.length).fill(0)
  for (let count = 0; count < total; count++) {
    const rotation = new Map<number, number[]>()
    vertices.forEach((v, i) => rotation.set(v, choices[i]![idx[i]!]!))
    const result = assignEmbedded(edges, comp.edges, vertices, rotation)
    if (result !== null) return {vertices, rotation, outerDart: result.outerDart, largeAngle: result.largeAngle}
    for (let i = 0; i < idx.length; i++) {
      if (++idx[i]! < choices[i]!.length) break
      idx[i] = 0
    }
  }
  return null
}

interface FaceData {
  /** Face of each dart of the component (indexed by dart id, -1 elsewhere). */
  faceOf: Map<number, number>
  faceCount: number
  /** Number of switch angles per face. */
  switches: number[]
  /** Darts in walk order per face. */
  walks: number[][]
}

function traceOwnFaces(edges: readonly Edge[], compEdges: number[], rotation: Map<number, number[]>): FaceData {
  const head = (d: number) => (d & 1 ? edges[d >> 1]![0] : edges[d >> 1]![1])
  const nextDart = (d: number) => {
    const v = head(d)
    const r = rotation.get(v)!
    const e2 = r[(r.indexOf(d >> 1) + 1) % r.length]!
    return edges[e2]![0] === v && !(edges[e2]![1] === v) ? 2 * e2 : 2 * e2 + 1
  }
  const faceOf = new Map<number, number>()
  const switches: number[] = []
  const walks: number[][] = []
  for (const e of compEdges) {
    for (const d0 of [2 * e, 2 * e + 1]) {
      if (faceOf.has(d0)) continue
      const f = walks.length
      const walk: number[] = []
      let sw = 0
      let d = d0
      do {
        faceOf.set(d, f)
        walk.push(d)
        const nd = nextDart(d)
        // Arriving along a forward dart means the edge points into the vertex; leaving along a
        // backward dart means that edge points into it too.
        const inA = (d & 1) === 0
        const inB = (nd & 1) === 1
        if (inA === inB) sw++
        d = nd
      } while (d !== d0)
      switches.push(sw)
      walks.push(walk)
    }
  }
  return {faceOf, faceCount: walks.length, switches, walks}
}

/**
 * The upward test of one fixed embedding of one component by exhaustion. Returns, for the first
 * face (in trace order) that works as the outer face, a dart of it and the large angles; null if none.
 */
function assignEmbedded(
  edges: readonly Edge[],
  compEdges: number[],
  vertices: number[],
  rotation: Map<number, number[]>
): {outerDart: number; largeAngle: Map<number, number>} | null {
  const all = outerFacesBruteForce(edges, compEdges, vertices, rotation, true)
  if (all === null || all.length === 0) return null
  return all[0]!
}

/**
 * Every face of a fixed embedding of one component that works as the outer face, each with its
 * assignment; null when the embedding is not planar or not bimodal. With firstOnly, stops at one.
 */
function outerFacesBruteForce(
  edges: readonly Edge[],
  compEdges: number[],
  vertices: number[],
  rotation: Map<number, number[]>,
  firstOnly: boolean
): Array<{outerDart: number; largeAngle: Map<number, number>}> | null {
  for (const v of vertices) {
    const r = rotation.get(v)!
    let changes = 0
    for (let i = 0; i < r.length; i++) {
      const a = edges[r[i]!]![0] === v
      const b = edges[r[(i + 1) % r.length]!]![0] === v
      if (a !== b) changes++
    }
    if (changes > 2) return null
  }
  const fd = traceOwnFaces(edges, compEdges, rotation)
  if (vertices.length - compEdges.length + fd.faceCount !== 2) return null
  // Sources and sinks with the faces of their angles (all their angles are switches).
  const extremes: number[] = []
  const options: number[][] = []
  const angleIn: Array<Map<number, number>> = []
  for (const v of vertices) {
    const r = rotation.get(v)!
    const allOut = r.every((e) => edges[e]![0] === v)
    const allIn = r.every((e) => edges[e]![1] === v)
    if (!allOut && !allIn) continue
    const byFace = new Map<number, number>()
    for (const e of r) {
      const dIn = edges[e]![1] === v ? 2 * e : 2 * e + 1
      const f = fd.faceOf.get(dIn)!
      if (!byFace.has(f)) byFace.set(f, dIn)
    }
    extremes.push(v)
    options.push([...byFace.keys()])
    angleIn.push(byFace)
  }
  const results: Array<{outerDart: number; largeAngle: Map<number, number>}> = []
  for (let f0 = 0; f0 < fd.faceCount; f0++) {
    const need = fd.switches.map((s, f) => s / 2 + (f === f0 ? 1 : -1))
    if (need.some((c) => c < 0)) continue
    const pick = new Array<number>(extremes.length).fill(-1)
    const solve = (i: number): boolean => {
      if (i === extremes.length) return need.every((c) => c === 0)
      for (const f of options[i]!) {
        if (need[f]! === 0) continue
        need[f]!--
        pick[i] = f
        if (solve(i + 1)) return true
        need[f]!++
      }
      return false
    }
    if (!solve(0)) continue
    const largeAngle = new Map<number, number>()
    extremes.forEach((v, i) => largeAngle.set(v, angleIn[i]!.get(pick[i]!)!))
    results.push({outerDart: fd.walks[f0]![0]!, largeAngle})
    if (firstOnly) break
  }
  return results
}

/**
 * The per-embedding answer for a whole graph with a given rotation system: for every dart, whether
 * the face on its left can be the outer face of its component (false everywhere when the embedding
 * is not planar or not bimodal); `upward` says whether every component has such a face.
 */
export function embeddedOuterFacesBruteForce(
  n: number,
  edges: readonly Edge[],
  rotation: ReadonlyArray<ArrayLike<number>>
): {upward: boolean; outerOk: boolean[]} {
  const outerOk = new Array<boolean>(2 * edges.length).fill(false)
  let upward = isAcyclic(n, edges)
  for (const comp of componentsOf(n, edges)) {
    const rot = new Map<number, number[]>()
    for (const v of comp.vertices) rot.set(v, Array.from(rotation[v]!))
    const res = upward ? outerFacesBruteForce(edges, comp.edges, comp.vertices, rot, false) : null
    if (res === null || res.length === 0) {
      upward = false
      continue
    }
    const fd = traceOwnFaces(edges, comp.edges, rot)
    const good = new Set(res.map((r) => fd.faceOf.get(r.outerDart)!))
    for (const [d, f] of fd.faceOf) if (good.has(f)) outerOk[d] = true
  }
  return {upward, outerOk}
}

/** Every labeled DAG on n vertices, as edge lists (each unordered pair absent, u->v or v->u). */
export function* labeledDags(n: number): Generator<Edge[]> {
  const pairs: Array<[number, number]> = []
  for (let u = 0; u < n; u++) for (let v = u + 1; v < n; v++) pairs.push([u, v])
  const total = 3 ** pairs.length
  for (let code = 0; code < total; code++) {
    const edges: Edge[] = []
    let c = code
    for (const [u, v] of pairs) {
      const t = c % 3
      c = (c - t) / 3
      if (t === 1) edges.push([u, v])
      else if (t === 2) edges.push([v, u])
    }
    if (isAcyclic(n, edges)) yield edges
  }
}

/**
 * Every bimodal rotation system of the whole graph (product of the per-vertex bimodal orders), planar
 * or not; throws RangeError past the cap.
 */
export function* bimodalRotationSystems(n: number, edges: readonly Edge[], cap = 1e5): Generator<number[][]> {
  const choices: number[][][] = []
  for (let v = 0; v < n; v++) {
    const ins: number[] = []
    const outs: number[] = []
    edges.forEach(([a, b], e) => {
      if (b === v) ins.push(e)
      if (a === v) outs.push(e)
    })
    choices.push(bimodalOrders(ins, outs))
  }
  const total = choices.reduce((p, c) => p * c.length, 1)
  if (total > cap) throw new RangeError(`oracle: ${total} rotation systems exceed the cap ${cap}`)
  const idx = new Array<number>(n).fill(0)
  for (let count = 0; count < total; count++) {
    yield choices.map((c, v) => c[idx[v]!]!)
    for (let i = 0; i < n; i++) {
      if (++idx[i]! < choices[i]!.length) break
      idx[i] = 0
    }
  }
}

/** Whether a rotation system of the whole graph is planar: V − E + F = 2 on every component. */
export function isPlanarRotation(n: number, edges: readonly Edge[], rotation: ReadonlyArray<ArrayLike<number>>): boolean {
  for (const comp of componentsOf(n, edges)) {
    const rot = new Map<number, number[]>()
    for (const v of comp.vertices) rot.set(v, Array.from(rotation[v]!))
    const fd = traceOwnFaces(edges, comp.edges, rot)
    if (comp.vertices.length - comp.edges.length + fd.faceCount !== 2) return false
  }
  return true
}

/**
 * Independent check of an upward-embedding witness: a planar bimodal rotation system, one outer face
 * per component (given by one of its darts), and a large angle per source and sink (the dart
 * entering it that names the angle after that dart's edge in clockwise order) such that every face
 * has n_f − 1 large angles, or n_f + 1 if outer. Returns null when fine, else what is wrong.
 */
export function checkUpwardWitness(
  n: number,
  edges: readonly Edge[],
  rotation: ReadonlyArray<ArrayLike<number>>,
  outerDarts: ArrayLike<number>,
  largeAngle: ArrayLike<number>
): string | null {
  if (!isAcyclic(n, edges)) return 'cyclic'
  const outerDartSet = Array.from(outerDarts)
  const comps = componentsOf(n, edges)
  if (outerDartSet.length !== comps.length) return `${outerDartSet.length} outer faces for ${comps.length} components`
  const covered = new Set<number>()
  for (const comp of comps) {
    const rot = new Map<number, number[]>()
    for (const v of comp.vertices) rot.set(v, Array.from(rotation[v]!))
    for (const v of comp.vertices) {
      const r = rot.get(v)!
      const want = edges.flatMap(([a, b], e) => (a === v || b === v ? [e] : [])).sort((x, y) => x - y)
      if (JSON.stringify([...r].sort((x, y) => x - y)) !== JSON.stringify(want)) return `rotation of ${v} is not its edges`
      let changes = 0
      for (let i = 0; i < r.length; i++) {
        if ((edges[r[i]!]![0] === v) !== (edges[r[(i + 1) % r.length]!]![0] === v)) changes++
      }
      if (changes > 2) return `vertex ${v} is not bimodal`
    }
    const fd = traceOwnFaces(edges, comp.edges, rot)
    if (comp.vertices.length - comp.edges.length + fd.faceCount !== 2) return 'not planar'
    const outers = outerDartSet.filter((d) => fd.faceOf.has(d))
    if (outers.length !== 1) return `component of ${comp.vertices[0]} has ${outers.length} outer faces`
    const f0 = fd.faceOf.get(outers[0]!)!
    const large = new Array<number>(fd.faceCount).fill(0)
    for (const v of comp.vertices) {
      covered.add(v)
      const r = rot.get(v)!
      const extreme = r.every((e) => edges[e]![0] === v) || r.every((e) => edges[e]![1] === v)
      const d = largeAngle[v]!
      if (!extreme) {
        if (d !== -1) return `vertex ${v} is neither source nor sink but has a large angle`
        continue
      }
      if (!(d >= 0 && d < 2 * edges.length)) return `source/sink ${v} has no large angle`
      const h = d & 1 ? edges[d >> 1]![0] : edges[d >> 1]![1]
      if (h !== v) return `large angle of ${v} is named by a dart entering ${h}`
      large[fd.faceOf.get(d)!]!++
    }
    for (let f = 0; f < fd.faceCount; f++) {
      const want = fd.switches[f]! / 2 + (f === f0 ? 1 : -1)
      if (large[f] !== want) return `face ${f} of the component of ${comp.vertices[0]} has ${large[f]} large angles, needs ${want}`
    }
  }
  for (let v = 0; v < n; v++) if (!covered.has(v) && largeAngle[v] !== -1) return `isolated vertex ${v} has a large angle`
  return null
}

/**
 * Independent check of a Hall-violation certificate for a fixed embedding: every listed vertex is a
 * source or a sink, each of its angles lies in one of the listed faces (given by one dart each), and
 * Σ (n_f − 1) over those faces, plus 2 if the outer face (outerDart's face) is among them, or plus 2
 * outright when outerDart is −1 (any outer face), is less than the number of vertices.
 */
export function checkHallViolation(
  n: number,
  edges: readonly Edge[],
  rotation: ReadonlyArray<ArrayLike<number>>,
  vertices: readonly number[],
  faceDarts: readonly number[],
  outerDart: number
): string | null {
  if (vertices.length === 0) return 'no vertices'
  const comps = componentsOf(n, edges)
  const comp = comps.find((c) => c.vertices.includes(vertices[0]!))
  if (comp === undefined) return 'vertex without edges'
  const rot = new Map<number, number[]>()
  for (const v of comp.vertices) rot.set(v, Array.from(rotation[v]!))
  const fd = traceOwnFaces(edges, comp.edges, rot)
  const listed = new Set<number>()
  for (const d of faceDarts) {
    const f = fd.faceOf.get(d)
    if (f === undefined) return `dart ${d} is not in the component`
    if (listed.has(f)) return 'a face is listed twice'
    listed.add(f)
  }
  if (new Set(vertices).size !== vertices.length) return 'a vertex is listed twice'
  for (const v of vertices) {
    const r = rot.get(v)
    if (r === undefined) return `vertex ${v} is in another component`
    if (!(r.every((e) => edges[e]![0] === v) || r.every((e) => edges[e]![1] === v))) return `vertex ${v} is neither source nor sink`
    for (const e of r) {
      const dIn = edges[e]![1] === v ? 2 * e : 2 * e + 1
      if (!listed.has(fd.faceOf.get(dIn)!)) return `an angle of ${v} lies outside the listed faces`
    }
  }
  let bound = 0
  for (const f of listed) bound += fd.switches[f]! / 2 - 1
  if (outerDart === -1) bound += 2
  else if (listed.has(fd.faceOf.get(outerDart)!)) bound += 2
  return bound < vertices.length ? null : `the faces can take ${bound} large angles, enough for ${vertices.length}`
}
