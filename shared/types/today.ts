import type { PartKind } from './domain'
import type { OrderSummaryDto } from './order'

export interface LowStockLineDto {
  partId: number
  partCode: string
  partName: string
  unit: string
  available: number
  reorderPoint: number
  onOrder: number
}

export interface ShortageLineDto {
  buildId: number
  buildName: string
  partId: number
  partCode: string
  partName: string
  unit: string
  shortQuantity: number
}

export interface ExpiryLineDto {
  lotId: number
  partId: number
  partCode: string
  partName: string
  unit: string
  binCode: string
  batchCode: string | null
  expiresOn: string
  quantity: number
  expired: boolean
}

/** The lists behind the Today counts; each is also reachable in full at /api/today/<list>. */
export const TODAY_LISTS = ['low-stock', 'shortages', 'expiry', 'orders'] as const
export type TodayList = (typeof TODAY_LISTS)[number]

export interface TodayDto {
  expiryWarningDays: number
  lowStock: { count: number; items: LowStockLineDto[] }
  /** Shortages on active builds (planned builds wait on the Builds screen). */
  shortages: { count: number; items: ShortageLineDto[] }
  expiry: { expired: number; expiring: number; items: ExpiryLineDto[] }
  orders: { open: number; late: number; items: OrderSummaryDto[] }
  charts: {
    stockValueByKind: { kind: PartKind; value: number }[]
    /** Monday of each of the last weeks, oldest first, with movement counts. */
    movementsPerWeek: { weekStart: string; receive: number; draw: number; other: number }[]
  }
}
