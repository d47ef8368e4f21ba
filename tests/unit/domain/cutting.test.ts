import { describe, expect, it } from 'vitest'
import { piecesFromBar, planCuts, type CuttingInput, type CuttingResult } from '../../../shared/domain/cutting'
import { prng } from '../../helpers/prng'

/** Brute force over every assignment of pieces to bars (or to "not cut"): the optimum to compare with. */
function bruteForce(input: CuttingInput) {
  const { kerfMm: k, facingMm: f } = input
  const pieces = input.cuts.flatMap((c) => Array.from({ length: c.qty }, () => c.lengthMm))
  const m = input.stock.length
  let best = { placed: -1, used: Infinity, count: Infinity }
  const choice = new Array(pieces.length).fill(0)
  const total = (m + 1) ** pieces.length
  for (let code = 0; code < total; code++) {
    let c = code
    for (let i = 0; i < pieces.length; i++) { choice[i] = c % (m + 1); c = Math.floor(c / (m + 1)) }
    const len = new Array(m).fill(0), cnt = new Array(m).fill(0)
    let placed = 0
    pieces.forEach((p, i) => { if (choice[i] < m) { len[choice[i]] += p + 2 * f; cnt[choice[i]]++; placed += p } })
    if (input.stock.some((s, b) => cnt[b] && len[b] + (cnt[b] - 1) * k > s.lengthMm + 1e-6)) continue
    const used = input.stock.reduce((t, s, b) => t + (cnt[b] ? s.lengthMm : 0), 0)
    const count = cnt.filter(Boolean).length
    const better = placed > best.placed + 1e-6 || (Math.abs(placed - best.placed) <= 1e-6 &&
      (used < best.used - 1e-6 || (Math.abs(used - best.used) <= 1e-6 && count < best.count)))
    if (better) best = { placed, used, count }
  }
  return best
}

/** Every millimetre of each bar is accounted for: pieces + facing + kerf + offcut + scrap = bar. */
function expectExactAccounting(input: CuttingInput, r: CuttingResult) {
  const { kerfMm: k, facingMm: f } = input
  for (const p of r.plans) {
    const pieces = p.cuts.reduce((t, c) => t + c.lengthMm, 0)
    expect(pieces + p.facingLossMm + p.kerfLossMm + p.offcutMm + p.scrapMm).toBeCloseTo(p.stockLengthMm, 6)
    expect(p.facingLossMm).toBeCloseTo(2 * f * p.cuts.length, 9)
    p.cuts.forEach((c, i) => {
      expect(c.endMm - c.startMm).toBeCloseTo(c.lengthMm + 2 * f, 6)
      if (i > 0) expect(c.startMm - p.cuts[i - 1].endMm).toBeCloseTo(k, 6)
    })
    expect(p.cuts.at(-1)!.endMm).toBeLessThanOrEqual(p.stockLengthMm + 1e-6)
    const n = p.cuts.length
    expect(p.sawCuts === n || p.sawCuts === n - 1).toBe(true)
    expect(p.kerfLossMm).toBeLessThanOrEqual(p.sawCuts * k + 1e-6)
  }
  const placed = r.plans.flatMap((p) => p.cuts).length + r.unplaced.reduce((t, u) => t + u.qty, 0)
  expect(placed).toBe(input.cuts.reduce((t, c) => t + c.qty, 0))
}

describe('cutting list with kerf (reference §7 [F][CP])', () => {
  it('cuts 6 pieces of 450 from 3000 with a 1.5 mm kerf, leaving 291 mm', () => {
    expect(piecesFromBar(3000, 450, 1.5)).toEqual({ pieces: 6, remnantMm: 291 })
    const input = { stock: [{ id: 'bar', lengthMm: 3000 }], cuts: [{ label: 'axle', lengthMm: 450, qty: 7 }], kerfMm: 1.5, facingMm: 0 }
    const r = planCuts(input)
    expect(r.plans[0]).toMatchObject({ sawCuts: 6, kerfLossMm: 9, offcutMm: 291, wasteMm: 9 })
    expect(r.plans[0].cuts).toHaveLength(6)
    expect(r.unplaced).toEqual([{ label: 'axle', lengthMm: 450, qty: 1 }])
    expect(r.method).toBe('exact')
    expectExactAccounting(input, r)
  })

  it('needs n − 1 cuts and leaves nothing on an exact fit', () => {
    expect(piecesFromBar(2001.5, 1000, 1.5)).toEqual({ pieces: 2, remnantMm: 0 })
    const r = planCuts({ stock: [{ id: 'a', lengthMm: 2001.5 }], cuts: [{ label: 'x', lengthMm: 1000, qty: 2 }], kerfMm: 1.5, facingMm: 0 })
    expect(r.plans[0]).toMatchObject({ sawCuts: 1, kerfLossMm: 1.5, offcutMm: 0 })
  })

  it('lets the last cut eat a stub thinner than the kerf', () => {
    const r = planCuts({ stock: [{ id: 'a', lengthMm: 101 }], cuts: [{ label: 'x', lengthMm: 100, qty: 1 }], kerfMm: 1.5, facingMm: 0 })
    expect(r.plans[0]).toMatchObject({ sawCuts: 1, kerfLossMm: 1, offcutMm: 0, scrapMm: 0 })
  })

  it('adds the facing allowance to both ends of each piece [CP 0.5–1 mm per end]', () => {
    const input = { stock: [{ id: 'a', lengthMm: 100 }], cuts: [{ label: 'bush', lengthMm: 20, qty: 2 }], kerfMm: 1, facingMm: 0.5 }
    const r = planCuts(input)
    expect(r.plans[0].cuts.map((c) => [c.startMm, c.endMm])).toEqual([[0, 21], [22, 43]])
    expect(r.plans[0]).toMatchObject({ facingLossMm: 2, kerfLossMm: 2, offcutMm: 56 })
    expectExactAccounting(input, r)
  })

  it('uses an offcut before opening a whole bar', () => {
    const r = planCuts({ stock: [{ id: 'bar', lengthMm: 1000 }, { id: 'offcut', lengthMm: 120 }], cuts: [{ label: 'x', lengthMm: 100, qty: 1 }], kerfMm: 1, facingMm: 0 })
    expect(r.plans.map((p) => p.stockId)).toEqual(['offcut'])
    expect(r.untouched).toEqual(['bar'])
  })

  it('counts remnants under the shortest useful offcut as scrap', () => {
    const r = planCuts({ stock: [{ id: 'a', lengthMm: 130 }], cuts: [{ label: 'x', lengthMm: 100, qty: 1 }], kerfMm: 1, facingMm: 0, minOffcutMm: 50 })
    expect(r.plans[0]).toMatchObject({ offcutMm: 0, scrapMm: 29, wasteMm: 30 })
  })

  it('agrees with brute force on 400 seeded random small cases, kerf accounted exactly', () => {
    const rand = prng(20240607)
    const pick = <T>(xs: T[]) => xs[Math.floor(rand() * xs.length)]
    for (let n = 0; n < 400; n++) {
      const stock = Array.from({ length: 1 + Math.floor(rand() * 3) }, (_, i) => ({ id: `s${i}`, lengthMm: pick([150, 300, 450, 600, 1000]) + Math.floor(rand() * 50) }))
      const cuts = Array.from({ length: 1 + Math.floor(rand() * 3) }, (_, i) => ({ label: `c${i}`, lengthMm: 20 + Math.floor(rand() * 400), qty: 1 + Math.floor(rand() * 3) }))
      while (cuts.reduce((t, c) => t + c.qty, 0) > 7) {
        if (cuts[0].qty > 1) cuts[0].qty--
        else cuts.pop()
      }
      const input = { stock, cuts, kerfMm: pick([0, 1, 1.5, 2.5]), facingMm: pick([0, 0.5, 1]) }
      const r = planCuts(input)
      const best = bruteForce(input)
      expect(r.method, `case ${n}`).toBe('exact')
      expect(r.totals.placedMm, `case ${n}`).toBeCloseTo(best.placed, 6)
      expect(r.totals.stockUsedMm, `case ${n}`).toBeCloseTo(best.used === Infinity ? 0 : best.used, 6)
      expect(r.totals.piecesUsed, `case ${n}`).toBe(best.count === Infinity ? 0 : best.count)
      expectExactAccounting(input, r)
    }
  })

  it('falls back to the heuristics for long lists and still accounts every millimetre', () => {
    const rand = prng(7)
    const input = {
      stock: Array.from({ length: 12 }, (_, i) => ({ id: `bar${i}`, lengthMm: 3000 })),
      cuts: Array.from({ length: 10 }, (_, i) => ({ label: `part ${i}`, lengthMm: 50 + Math.floor(rand() * 900), qty: 4 })),
      kerfMm: 1.5,
      facingMm: 0.5,
    }
    const r = planCuts(input)
    expect(r.method).toBe('heuristic')
    expect(r.unplaced).toEqual([])
    expectExactAccounting(input, r)
  })
})
