/** Words and number formats the parts screens share. */
import type { PartKind } from '../../../shared/types/domain'
import type { PartQueryDto, PartSummaryDto } from '../../../shared/types/part'
import { palette } from '../../theme'

export const KIND_LABELS: Record<PartKind, string> = {
  fastener: 'Fasteners',
  gasket: 'Gaskets & seals',
  stock: 'Bar, tube & sheet',
  compound: 'Compounds & oils',
  other: 'Other',
}

/** One word for a row's kind: its fastener type or bar section when it has one. */
export const kindWord = (p: Pick<PartSummaryDto, 'kind' | 'form'>) =>
  p.form ?? KIND_LABELS[p.kind].split(/[ ,&]/)[0].toLowerCase()

/** Quantities as a storekeeper reads them: whole items plain, lengths and volumes to 0.1. */
export function formatQuantity(n: number, unit: string): string {
  const shown = Number.isInteger(n) ? n.toLocaleString('en-GB') : n.toLocaleString('en-GB', { maximumFractionDigits: 1 })
  return `${shown} ${unit}`
}

export type StockState = 'short' | 'low' | 'ok'

/** Nothing free (or reservations above stock): short; at or below the reorder point: low. */
export function stockState(p: Pick<PartSummaryDto, 'available' | 'onHand' | 'reorderPoint'>): StockState {
  if (p.available <= 0) return 'short'
  if (p.reorderPoint > 0 && p.onHand <= p.reorderPoint) return 'low'
  return 'ok'
}

export const STOCK_STATE_COLOUR: Record<StockState, string> = {
  short: palette.shortage,
  low: palette.caution,
  ok: palette.ink,
}

export const STOCK_STATE_TEXT: Record<StockState, string> = {
  short: 'none free',
  low: 'at or below reorder point',
  ok: '',
}

/**
 * The words to mark in a row: the leftover words and corrections of the query, and how the
 * recognised thread, type and material appear in names ("7BA", "M3", "brass").
 */
export function highlightTerms(u: PartQueryDto | undefined): string[] {
  if (!u) return []
  const terms = [...u.text.split(' '), ...(u.corrections ?? []).map((c) => c.to), u.form, u.material?.split(' ')[0]]
  if (u.threadKey) terms.push(u.threadKey.replace(/x[\d.]+$/, '').replace(/(UNC|UNF|ME|BSW|BSF)$/, ''))
  return terms.filter((t): t is string => !!t && t.length > 1)
}
