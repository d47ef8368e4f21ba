/** Number formatting for the supply and order screens. */

/** Up to `places` decimals, trailing zeros dropped: 12, 2.5, 0.125. */
export const fmt = (n: number | null | undefined, places = 2) =>
  n === null || n === undefined ? '–' : String(Number(n.toFixed(places)))

/** Money to two places; the workshop's currency is left to the reader (settings hold no currency yet). */
export const money = (n: number | null | undefined) => (n === null || n === undefined ? '–' : n.toFixed(2))

export const qty = (n: number, unit: string) => `${fmt(n, 3)} ${unit}`
