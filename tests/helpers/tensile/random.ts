/** Small seeded generator (mulberry32) so noisy test curves are the same on every run. */
export function seededRandom(seed: number): () => number {
  let state = seed >>> 0
  return () => {
    state = (state + 0x6d2b79f5) >>> 0
    let t = state
    t = Math.imul(t ^ (t >>> 15), t | 1)
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}

/** Standard normal deviates by the Box–Muller transform, from a seeded generator. */
export function seededGaussian(seed: number): () => number {
  const uniform = seededRandom(seed)
  return () => {
    const u = Math.max(uniform(), Number.MIN_VALUE)
    return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * uniform())
  }
}
