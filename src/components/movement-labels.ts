import type { MovementKind } from '../../shared/types/domain'

/** How each movement kind reads in the ledger (our own wording). */
export const MOVEMENT_LABELS: Record<MovementKind, string> = {
  receive: 'Received',
  draw: 'Taken',
  return: 'Put back',
  move: 'Moved',
  adjust: 'Adjusted',
  count: 'Counted',
}

/** Tag colours: stock in green, out red, within the stores slate, corrections brass. */
export const MOVEMENT_COLOURS: Record<MovementKind, string> = {
  receive: 'green',
  draw: 'red',
  return: 'cyan',
  move: 'default',
  adjust: 'gold',
  count: 'gold',
}

/** "12", "310 mm", "2 bottle": quantities without float noise (bar lengths to 0.1 mm). */
export function formatQuantity(quantity: number, unit: string): string {
  const n = Math.round(quantity * 10) / 10
  return unit && unit !== 'pcs' ? `${n} ${unit}` : String(n)
}

export const formatWhen = (iso: string) =>
  new Date(iso).toLocaleString(undefined, { dateStyle: 'medium', timeStyle: 'short' })
