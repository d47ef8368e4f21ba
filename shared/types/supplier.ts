/** Suppliers, what they offer, and a part's reorder rules with the suggestion behind them. */

export interface SupplierDto {
  id: number
  name: string
  email: string
  website: string
  leadTimeDays: number
  notes: string
  /** How many parts this supplier offers. */
  offerCount: number
}

/** One supplier's offer of one part: their code, the pack it comes in and the pack's price. */
export interface SupplierOfferDto {
  id: number
  supplierId: number
  supplierName: string
  partId: number
  partCode: string
  partName: string
  unit: string
  supplierCode: string
  packSize: number
  packPrice: number
  /** packPrice ÷ packSize. */
  unitPrice: number
  leadTimeDays: number
  preferred: boolean
}

export interface SupplierDetailDto extends SupplierDto {
  offers: SupplierOfferDto[]
}

/** One step of the reorder suggestion, shown as "label: formula = value". */
export interface SuggestionStep {
  label: string
  formula: string
  value: number | null
  unit?: string
}

export interface ReorderSuggestionDto {
  windowDays: number
  /** Net use (draws − returns) inside the window. */
  used: number
  drawCount: number
  dailyUse: number
  sigmaDaily: number
  leadTimeDays: number
  leadTimeFrom: 'supplier' | 'given' | 'default'
  safetyStock: number
  safetyStockFrom: 'given' | 'computed'
  reorderPoint: number
  annualDemand: number
  orderCost: number
  holdingCostPerUnitYear: number
  packSize: number
  /** Q* = √(2DS/H) before rounding; null when it cannot be worked out (no use or no cost). */
  eoq: number | null
  packs: number | null
  orderQuantity: number | null
  /** Why the order quantity could not be suggested, when it could not. */
  eoqProblem: string | null
  steps: SuggestionStep[]
  /** False when the window holds no draws: the figures are then no guide. */
  enoughHistory: boolean
}

/** What the part page's supply panel shows. */
export interface PartSupplyDto {
  part: {
    id: number
    code: string
    name: string
    kind: string
    unit: string
    reorderPoint: number
    reorderQuantity: number
    preferredSupplierId: number | null
    unitCost: number
    onHand: number
    reserved: number
    available: number
    /** Still to arrive on open purchase orders. */
    onOrder: number
  }
  offers: SupplierOfferDto[]
}
