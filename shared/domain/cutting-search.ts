/**
 * The search behind the cutting list, as one-dimensional bin packing.
 * Cutting n pieces of lengths cᵢ from a bar of length L with kerf k fits when Σcᵢ + (n − 1)k ≤ L,
 * i.e. Σ(cᵢ + k) ≤ L + k: each piece takes its length plus one kerf from a bar of capacity L + k.
 */

export interface PackItem {
  /** Finished length: what counts as "placed". */
  length: number
  /** Length plus facing allowance plus one kerf. */
  size: number
}
export interface PackBin {
  length: number
  /** Bar length plus one kerf. */
  capacity: number
}

/** Which bin each item went to (-1: not placed). */
export type Assignment = number[]

/** What the search optimises, in order: most length placed, least stock opened, fewest pieces opened. */
export interface PackScore {
  placed: number
  used: number
  pieces: number
}

/** Lengths within a micrometre are equal: far below any saw's accuracy (mm). */
export const LENGTH_EPSILON = 1e-6
/** Nodes the exact search may visit before it settles for the best plan found so far. */
export const EXACT_NODE_BUDGET = 400_000

export function scoreOf(items: readonly PackItem[], bins: readonly PackBin[], a: Assignment): PackScore {
  const opened = new Set<number>()
  let placed = 0
  a.forEach((b, i) => {
    if (b < 0) return
    placed += items[i].length
    opened.add(b)
  })
  let used = 0
  for (const b of opened) used += bins[b].length
  return { placed, used, pieces: opened.size }
}

/** True when `a` is strictly better than `b`. */
export function better(a: PackScore, b: PackScore): boolean {
  if (a.placed > b.placed + LENGTH_EPSILON) return true
  if (a.placed < b.placed - LENGTH_EPSILON) return false
  if (a.used < b.used - LENGTH_EPSILON) return true
  if (a.used > b.used + LENGTH_EPSILON) return false
  return a.pieces < b.pieces
}

/** First fit decreasing over bins shortest first (so offcuts are used before whole bars). */
export function firstFitDecreasing(items: readonly PackItem[], bins: readonly PackBin[]): Assignment {
  const order = bins.map((_, i) => i).sort((x, y) => bins[x].length - bins[y].length || x - y)
  const room = bins.map((b) => b.capacity)
  return items.map((it) => {
    const b = order.find((j) => room[j] >= it.size - LENGTH_EPSILON) ?? -1
    if (b >= 0) room[b] -= it.size
    return b
  })
}

/** Best fit decreasing: each piece into the bar it leaves the least room in. */
export function bestFitDecreasing(items: readonly PackItem[], bins: readonly PackBin[]): Assignment {
  const room = bins.map((b) => b.capacity)
  return items.map((it) => {
    let best = -1
    room.forEach((r, j) => {
      if (r >= it.size - LENGTH_EPSILON && (best < 0 || r < room[best])) best = j
    })
    if (best >= 0) room[best] -= it.size
    return best
  })
}

/**
 * Branch and bound over every assignment, items already sorted longest first. Returns the optimum
 * and whether the search finished inside the node budget (if not, the best plan found so far).
 */
export function exactPack(items: readonly PackItem[], bins: readonly PackBin[], start: Assignment) {
  const n = items.length
  const out = bins.length // "not placed" sorts after every bar, for the symmetry rule below
  const room = bins.map((b) => b.capacity)
  const load = new Array(bins.length).fill(0)
  const choice: number[] = new Array(n).fill(out)
  const suffix = new Array(n + 1).fill(0)
  for (let i = n - 1; i >= 0; i--) suffix[i] = suffix[i + 1] + items[i].length
  let best = [...start]
  let bestScore = scoreOf(items, bins, best)
  let nodes = 0

  const visit = (i: number, placed: number, used: number, pieces: number): boolean => {
    if (++nodes > EXACT_NODE_BUDGET) return false
    const roomLeft = room.reduce((s, r) => s + Math.max(0, r), 0)
    if (!better({ placed: placed + Math.min(suffix[i], roomLeft), used, pieces }, bestScore)) return true
    if (i === n) {
      best = choice.map((c) => (c === out ? -1 : c))
      bestScore = { placed, used, pieces }
      return true
    }
    // Identical pieces are interchangeable: each goes to the same or a later bar than the one before.
    const same = i > 0 && Math.abs(items[i].size - items[i - 1].size) < LENGTH_EPSILON
    const from = same ? choice[i - 1] : 0
    const triedFresh = new Set<number>()
    for (let b = from; b < out; b++) {
      if (room[b] < items[i].size - LENGTH_EPSILON) continue
      if (!load[b]) {
        // Unopened bars of equal length are interchangeable too: open only the first of each length.
        if (triedFresh.has(bins[b].length)) continue
        triedFresh.add(bins[b].length)
      }
      const fresh = load[b] === 0
      room[b] -= items[i].size
      load[b]++
      choice[i] = b
      const ok = visit(i + 1, placed + items[i].length, used + (fresh ? bins[b].length : 0), pieces + (fresh ? 1 : 0))
      load[b]--
      room[b] += items[i].size
      if (!ok) return false
    }
    choice[i] = out
    return visit(i + 1, placed, used, pieces)
  }

  const finished = visit(0, 0, 0, 0)
  return { assignment: best, score: bestScore, finished }
}
