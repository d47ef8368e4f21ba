/** Display helpers shared by the build screens. */

/** Quantities are floats (bar mm); show at most 1 decimal, none for whole numbers. */
export function formatNumber(n: number): string {
  const r = Math.round(n * 10) / 10
  return Number.isInteger(r) ? String(r) : r.toFixed(1)
}

/** "24 pcs", "125 mm", "2 bottle". */
export const formatQuantity = (n: number, unit: string) => `${formatNumber(n)} ${unit}`.trim()

/** Tag colours of the build statuses (ant-design-vue preset names; the status word is always shown). */
export const STATUS_COLOURS: Record<string, string> = {
  planned: 'default', active: 'gold', finished: 'green', shelved: 'default',
}
