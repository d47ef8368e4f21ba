/** The requests behind the bin page's quick actions: S's stock routes and B's build draw. */
import { stockApi } from '../../api/stock'
import { buildsApi } from '../../api/builds'
import { amount, modeOf, type BinAction } from './bin-lines'
import type { BinDto, BinLineDto } from '../../../shared/types/stock'
import type { DrawLineDto } from '../../../shared/types/bin-page'

export interface ActionForm {
  /** Items or containers; for bar stock the length in mm (cut, or the offcut put back). */
  quantity: number
  reason: string
  allowExpired: boolean
  allowReserved: boolean
  drawLine?: DrawLineDto
  toBinId?: number
  toBinCode?: string
}

/** Runs one quick action and returns the sentence the user sees when it is done. */
export async function runAction(mode: BinAction, bin: BinDto, line: BinLineDto, f: ActionForm): Promise<string> {
  const bar = modeOf(line) === 'length'
  const what = `${line.partName}`
  const reason = f.reason.trim()
  switch (mode) {
    case 'take':
      await stockApi.take({
        partId: line.partId, binId: bin.id, quantity: f.quantity, reason,
        ...(bar || modeOf(line) === 'batch' ? { lotId: line.lotId } : {}),
        ...(f.allowExpired ? { allowExpired: true } : {}), ...(f.allowReserved ? { allowReserved: true } : {}),
      })
      return `Took ${amount(f.quantity, line.unit)} of ${what} from ${bin.code}.`
    case 'return':
      await stockApi.putBack({
        partId: line.partId, binId: bin.id, quantity: f.quantity, reason,
        ...(modeOf(line) === 'batch' ? { lotId: line.lotId } : {}),
      })
      return bar ? `Put a ${amount(f.quantity, 'mm')} offcut of ${what} back in ${bin.code}.` : `Put ${amount(f.quantity, line.unit)} of ${what} back in ${bin.code}.`
    case 'draw': {
      const l = f.drawLine!
      await buildsApi.draw(l.buildId, l.bar
        ? { lineId: l.lineId, lotId: line.lotId, binId: bin.id, pieces: f.quantity, reason }
        : { lineId: l.lineId, binId: bin.id, quantity: f.quantity, reason, ...(modeOf(line) === 'batch' ? { lotId: line.lotId } : {}) })
      return `Drew ${l.bar ? `${f.quantity} piece${f.quantity === 1 ? '' : 's'}` : amount(f.quantity, line.unit)} of ${what} for ${l.buildName}.`
    }
    case 'move':
      await stockApi.move(bar || modeOf(line) === 'batch'
        ? { lotId: line.lotId, toBinId: f.toBinId!, reason, ...(bar ? {} : { quantity: f.quantity }) }
        : { partId: line.partId, fromBinId: bin.id, toBinId: f.toBinId!, quantity: f.quantity, reason })
      return `Moved ${bar ? 'the piece' : amount(f.quantity, line.unit)} of ${what} to another bin.`
  }
}

/** Sensible starting quantity for an action on a line. */
export function defaultQuantity(mode: BinAction, line: BinLineDto, drawLine?: DrawLineDto): number {
  const bar = modeOf(line) === 'length'
  if (mode === 'move') return line.quantity
  if (mode === 'draw' && drawLine) return Math.max(1, Math.min(drawLine.open, drawLine.bar ? drawLine.open : line.quantity))
  if (bar) return mode === 'return' ? 100 : Math.min(100, line.quantity)
  return 1
}
