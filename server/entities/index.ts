import { Alert } from './Alert'
import { Attachment } from './Attachment'
import { Bin } from './Bin'
import { Build } from './Build'
import { BuildLine } from './BuildLine'
import { Movement } from './Movement'
import { OutboxMessage } from './OutboxMessage'
import { Part } from './Part'
import { PurchaseLine } from './PurchaseLine'
import { PurchaseOrder } from './PurchaseOrder'
import { Rack } from './Rack'
import { Reservation } from './Reservation'
import { SessionRecord } from './SessionRecord'
import { Setting } from './Setting'
import { StockLot } from './StockLot'
import { Supplier } from './Supplier'
import { SupplierPart } from './SupplierPart'
import { User } from './User'
import { Workshop } from './Workshop'

export {
  Alert, Attachment, Bin, Build, BuildLine, Movement, OutboxMessage, Part, PurchaseLine,
  PurchaseOrder, Rack, Reservation, SessionRecord, Setting, StockLot, Supplier, SupplierPart,
  User, Workshop,
}

/** Listed explicitly (not a glob) so tsx, vitest and the CLI load the same classes. */
export const entities = [
  Alert, Attachment, Bin, Build, BuildLine, Movement, OutboxMessage, Part, PurchaseLine,
  PurchaseOrder, Rack, Reservation, SessionRecord, Setting, StockLot, Supplier, SupplierPart,
  User, Workshop,
]
