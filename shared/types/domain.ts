/** Names shared by the data model, the API and the client. */

export const PART_KINDS = ['fastener', 'gasket', 'stock', 'compound', 'other'] as const
export type PartKind = (typeof PART_KINDS)[number]

/**
 * How a kind of part is held in stock:
 * count — whole items (fasteners, gaskets); length — bar/tube/sheet pieces, quantities in mm;
 * batch — compounds and oils, each batch with its expiry date, drawn first-expiry-first-out.
 */
export type StockMode = 'count' | 'length' | 'batch'
export const stockModeOf = (kind: PartKind): StockMode =>
  kind === 'stock' ? 'length' : kind === 'compound' ? 'batch' : 'count'

export const MOVEMENT_KINDS = ['receive', 'draw', 'return', 'move', 'adjust', 'count'] as const
export type MovementKind = (typeof MOVEMENT_KINDS)[number]

export const BUILD_STATUSES = ['planned', 'active', 'finished', 'shelved'] as const
export type BuildStatus = (typeof BUILD_STATUSES)[number]

export const ORDER_STATUSES = [
  'draft', 'sent', 'part-received', 'received', 'closed', 'cancelled',
] as const
export type OrderStatus = (typeof ORDER_STATUSES)[number]

export const ALERT_KINDS = ['low-stock', 'expiring', 'expired', 'shortage'] as const
export type AlertKind = (typeof ALERT_KINDS)[number]
