import type { OrderStatus } from '../../../shared/types/domain'

/** Status words and tag colours for purchase orders. */
export const ORDER_STATUS_LABELS: Record<OrderStatus, string> = {
  draft: 'draft', sent: 'sent', 'part-received': 'part received', received: 'received', closed: 'closed', cancelled: 'cancelled',
}
export const ORDER_STATUS_COLOURS: Record<OrderStatus, string> = {
  draft: 'default', sent: 'blue', 'part-received': 'gold', received: 'green', closed: 'default', cancelled: 'default',
}

/** A draft's line as the editor holds it. */
export interface DraftLine {
  partId: number
  partCode: string
  partName: string
  unit: string
  packs: number
  packSize: number
  packPrice: number
}
