/**
 * Rows of a rotation system as Int32Array copies in a plain array built by push. Hot readers of
 * rotations (bimodality, face tracing, the fixed-embedding test) stay monomorphic only if the outer
 * array always has the same elements kind: an Array#map result is holey when the builtin makes it and
 * packed when optimized code does, so readers fed both deoptimized on "wrong map" and recompiled.
 */
export function int32Rows<T>(items: readonly T[], row: (item: T, i: number) => ArrayLike<number>): Int32Array[] {
  const out: Int32Array[] = []
  for (let i = 0; i < items.length; i++) out.push(Int32Array.from(row(items[i]!, i)))
  return out
}
