import type { OrderStatus, PartKind } from './domain'

/** One part the Orders screen suggests ordering, quantities in the part's unit, whole packs. */
export interface SuggestionLineDto {
  partId: number
  partCode: string
  partName: string
  kind: PartKind
  unit: string
  onHand: number
  reserved: number
  available: number
  onOrder: number
  /** Open builds' shortages of this part. */
  shortage: number
  reorderPoint: number
  reorderQuantity: number
  supplierCode: string
  packSize: number
  packPrice: number
  packs: number
  quantity: number
  lineCost: number
  reasons: ('low-stock' | 'shortage')[]
  explanation: string
}

/** Suggestions for one supplier (the parts' preferred one); supplierId null: no supplier yet. */
export interface SuggestionGroupDto {
  supplierId: number | null
  supplierName: string
  supplierEmail: string
  leadTimeDays: number
  lines: SuggestionLineDto[]
  total: number
}

export interface OrderLineDto {
  id: number
  partId: number
  partCode: string
  partName: string
  kind: PartKind
  unit: string
  supplierCode: string
  quantity: number
  packSize: number
  packs: number
  packPrice: number
  lineCost: number
  receivedQuantity: number
  remaining: number
  /** Where this part already lives (its biggest lot, else a bin meant for it): the receipt's default bin. */
  suggestedBinId: number | null
}

export interface OrderSummaryDto {
  id: number
  number: string
  supplierId: number
  supplierName: string
  status: OrderStatus
  lineCount: number
  total: number
  createdAt: string
  createdByName: string
  sentAt: string | null
  expectedOn: string | null
  /** Sent or part-received and past the expected date. */
  late: boolean
}

/** An e-mail that carried the order, with its delivery state from the outbox. */
export interface OrderEmailDto {
  id: number
  to: string
  status: string
  tries: number
  lastError: string | null
  sentAt: string | null
}

export interface OrderDetailDto extends OrderSummaryDto {
  notes: string
  supplierEmail: string
  lines: OrderLineDto[]
  emails: OrderEmailDto[]
}
