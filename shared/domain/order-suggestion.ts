/**
 * How much of a part to order, in whole packs, from what the stores have, what is already on
 * order, what builds are short of, and the part's reorder rules. Pure, so the Orders screen,
 * the digest e-mail and the tests agree.
 */

export interface OrderNeedInput {
  /** On hand − reserved. */
  available: number
  /** Still to arrive on open orders (drafts included). */
  onOrder: number
  /** Σ shortQuantity of open builds' lines: asked for, not covered by stores. */
  shortage: number
  reorderPoint: number
  reorderQuantity: number
  packSize: number
}

export interface OrderNeed {
  /** available + on order − shortage: free stock once open orders arrive and shortages are met. */
  position: number
  /** Units needed before rounding to packs. */
  needed: number
  packs: number
  quantity: number
  /** One line a storekeeper can check by hand. */
  explanation: string
}

/** Floating-point slack so 3.0000000001 packs is 3 packs (bar lengths are floats). */
const EPSILON = 1e-9
const n = (x: number) => String(Math.round(x * 1000) / 1000)

/**
 * (s, Q) rule, common practice: when the position falls to the reorder point s or below, order
 * Q (the reorder quantity), or more if Q would still leave the position at or below s; build
 * shortages are added on top. Parts without a reorder point are ordered only for shortages.
 * Returns null when nothing needs ordering.
 */
export function orderNeed(input: OrderNeedInput): OrderNeed | null {
  const { available, onOrder, shortage, reorderPoint: s, reorderQuantity: q } = input
  const packSize = input.packSize > 0 ? input.packSize : 1
  const position = available + onOrder - shortage
  let needed = 0
  let why = ''
  if (s > 0 && position <= s + EPSILON) {
    needed = Math.max(q, s - position + 1)
    why = q >= s - position + 1
      ? `position ${n(position)} ≤ reorder point ${n(s)}: order the reorder quantity ${n(q)}`
      : `position ${n(position)} ≤ reorder point ${n(s)}: order ${n(needed)} to get back above it`
  } else if (position < -EPSILON) {
    needed = -position
    why = `builds are short of ${n(-position)} more than stores and open orders cover`
  }
  if (needed <= EPSILON) return null
  const packs = Math.max(1, Math.ceil(needed / packSize - EPSILON))
  return {
    position, needed, packs, quantity: packs * packSize,
    explanation: `available ${n(available)} + on order ${n(onOrder)} − short ${n(shortage)} = ${n(position)}; ${why}; ${packs} pack(s) of ${n(packSize)}`,
  }
}
