/**
 * Cutting list: which stock piece each required length comes from, where along it, and what is left.
 * Exact (branch and bound) for small lists, the better of first-fit and best-fit decreasing beyond.
 * Used by the workbench and by builds planning draws of bar stock.
 */
import {
  LENGTH_EPSILON, bestFitDecreasing, better, exactPack, firstFitDecreasing, scoreOf,
  type Assignment, type PackBin, type PackItem,
} from './cutting-search'

export interface StockPiece {
  id: string
  lengthMm: number
}
export interface CutRequest {
  label: string
  lengthMm: number
  qty: number
}
export interface CuttingInput {
  stock: StockPiece[]
  cuts: CutRequest[]
  /** Width of the saw cut [common practice: hacksaw ≈ 1 mm, small bandsaw 1.3–1.6, parting tool 2–3]. */
  kerfMm: number
  /** Allowance faced off each end of each piece [common practice: 0.5–1 mm per end]. */
  facingMm: number
  /** Remnants shorter than this are scrap, not offcuts returned to stock. */
  minOffcutMm?: number
}

/** One piece along a bar: it occupies startMm..endMm (finished length plus both facing allowances). */
export interface PlannedCut {
  label: string
  lengthMm: number
  startMm: number
  endMm: number
}
export interface StockPlan {
  stockId: string
  stockLengthMm: number
  /** In order from the end of the bar you start at. Saw at each endMm (the kerf lies just beyond it). */
  cuts: PlannedCut[]
  sawCuts: number
  kerfLossMm: number
  facingLossMm: number
  /** Remnant that goes back to stock (0 when none). */
  offcutMm: number
  /** Remnant shorter than the minimum offcut, thrown away. */
  scrapMm: number
  /** kerf + facing + scrap. */
  wasteMm: number
}
export interface CuttingResult {
  /** One plan per stock piece that is cut, in the order the stock was given. */
  plans: StockPlan[]
  /** Stock pieces left whole. */
  untouched: string[]
  /** Pieces that did not fit in the stock given. */
  unplaced: CutRequest[]
  /** `exact`: proven best plan; `heuristic`: best of FFD/BFD (and any improvement the search found). */
  method: 'exact' | 'heuristic'
  totals: { placedMm: number; stockUsedMm: number; wasteMm: number; offcutMm: number; piecesUsed: number }
}

/** Lists up to this many pieces in all get the exact search; beyond, heuristics only. */
export const EXACT_MAX_PIECES = 16

interface Item extends PackItem {
  label: string
}

const round = (x: number) => Number(x.toFixed(3))

/** Plans the cuts: most length placed, then least stock opened (offcuts before whole bars), then fewest pieces. */
export function planCuts(input: CuttingInput): CuttingResult {
  const { kerfMm: k, facingMm: f } = input
  const items: Item[] = input.cuts
    .flatMap((c) => Array.from({ length: c.qty }, () => ({ label: c.label, length: c.lengthMm, size: c.lengthMm + 2 * f + k })))
    .sort((a, b) => b.size - a.size || a.label.localeCompare(b.label))
  const bins: PackBin[] = input.stock.map((s) => ({ length: s.lengthMm, capacity: s.lengthMm + k }))
  const { assignment, exact } = search(items, bins)
  const plans: StockPlan[] = []
  const untouched: string[] = []
  input.stock.forEach((s, b) => {
    const mine = items.filter((_, i) => assignment[i] === b)
    if (mine.length) plans.push(layOut(s, mine, input))
    else untouched.push(s.id)
  })
  const unplaced = groupUnplaced(items.filter((_, i) => assignment[i] < 0))
  const sum = (key: 'wasteMm' | 'offcutMm' | 'stockLengthMm') => round(plans.reduce((t, p) => t + p[key], 0))
  return {
    plans,
    untouched,
    unplaced,
    method: exact ? 'exact' : 'heuristic',
    totals: {
      placedMm: round(scoreOf(items, bins, assignment).placed),
      stockUsedMm: sum('stockLengthMm'),
      wasteMm: sum('wasteMm'),
      offcutMm: sum('offcutMm'),
      piecesUsed: plans.length,
    },
  }
}

function search(items: Item[], bins: PackBin[]): { assignment: Assignment; exact: boolean } {
  const ffd = firstFitDecreasing(items, bins)
  const bfd = bestFitDecreasing(items, bins)
  const start = better(scoreOf(items, bins, bfd), scoreOf(items, bins, ffd)) ? bfd : ffd
  if (items.length > EXACT_MAX_PIECES || !items.length || !bins.length) return { assignment: start, exact: !items.length || !bins.length }
  const r = exactPack(items, bins, start)
  return { assignment: r.assignment, exact: r.finished }
}

/**
 * Lays pieces along one bar, longest first. With n pieces and R = L − Σ(pieces + facing) − (n − 1)·kerf
 * left after the last one: R = 0 needs n − 1 saw cuts; otherwise the n-th cut takes min(R, kerf) and the
 * rest is the remnant. So L = Σ lengths + facing + kerf loss + remnant, exactly.
 */
function layOut(s: StockPiece, mine: Item[], input: CuttingInput): StockPlan {
  const { kerfMm: k, facingMm: f, minOffcutMm = 0 } = input
  let at = 0
  const cuts = mine.map((it, i) => {
    const startMm = at + (i > 0 ? k : 0)
    at = startMm + it.length + 2 * f
    return { label: it.label, lengthMm: it.length, startMm: round(startMm), endMm: round(at) }
  })
  const rest = Math.max(0, s.lengthMm - at)
  const lastCut = rest > LENGTH_EPSILON
  const kerfLoss = (mine.length - 1) * k + (lastCut ? Math.min(rest, k) : 0)
  const remnant = lastCut ? Math.max(0, rest - k) : 0
  const isOffcut = remnant > LENGTH_EPSILON && remnant >= minOffcutMm
  const facingLoss = 2 * f * mine.length
  const scrap = isOffcut ? 0 : remnant
  return {
    stockId: s.id,
    stockLengthMm: s.lengthMm,
    cuts,
    sawCuts: mine.length - 1 + (lastCut ? 1 : 0),
    kerfLossMm: round(kerfLoss),
    facingLossMm: round(facingLoss),
    offcutMm: round(isOffcut ? remnant : 0),
    scrapMm: round(scrap),
    wasteMm: round(kerfLoss + facingLoss + scrap),
  }
}

function groupUnplaced(left: Item[]): CutRequest[] {
  const groups = new Map<string, CutRequest>()
  for (const it of left) {
    const key = `${it.label}\u0000${it.length}`
    const g = groups.get(key)
    if (g) g.qty++
    else groups.set(key, { label: it.label, lengthMm: it.length, qty: 1 })
  }
  return [...groups.values()]
}

/** Pieces of length l from a bar L with kerf k: n = ⌊(L + k)/(l + k)⌋; remnant L − n·l − n·k, or 0 on an exact fit. */
export function piecesFromBar(barMm: number, pieceMm: number, kerfMm: number) {
  const n = Math.floor((barMm + kerfMm + LENGTH_EPSILON) / (pieceMm + kerfMm))
  const exactFit = Math.abs(barMm - n * pieceMm - (n - 1) * kerfMm) < LENGTH_EPSILON
  return { pieces: n, remnantMm: exactFit ? 0 : round(Math.max(0, barMm - n * pieceMm - n * kerfMm)) }
}
