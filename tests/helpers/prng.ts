/**
 * mulberry32, a tiny seeded pseudo-random generator (common practice): one seed replays one
 * series exactly, so a failing random test or soak can be run again as it was.
 */
export function prng(seed: number): () => number {
  let state = seed | 0
  return () => {
    state = (state + 0x6d2b79f5) | 0
    let r = Math.imul(state ^ (state >>> 15), 1 | state)
    r = (r + Math.imul(r ^ (r >>> 7), 61 | r)) ^ r
    return ((r ^ (r >>> 14)) >>> 0) / 4294967296
  }
}
