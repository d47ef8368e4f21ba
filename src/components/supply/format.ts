/** Number formatting for the supply and order screens. */

/** Up to `places` decimals, trailing zeros dropped: 12, 2.5, 0.125. */
export const fmt = (n: number | null | undefined, places = 2) =>
  n === null || n === undefined ? '–' : String(Number(n.toFixed(places)))

/** Money to two places; the workshop's currency is left to the reader (settings hold no currency yet). */
export const money = (n: number | null | undefined) => (n === null || n === undefined ? '–' : n.toFixed(2))

export const qty = (n: number, unit: string) => `${fmt(n, 3)} ${unit}`

/** A unit price: two places, or up to four when pennies are split (bar stock priced per mm). */
export const price = (n: number) => (Math.abs(n * 100 - Math.round(n * 100)) < 1e-9 ? n.toFixed(2) : String(Number(n.toFixed(4))))
