import { inTransaction } from '../../server/db'
import { Bin, Rack, Supplier, SupplierPart, Workshop } from '../../server/entities'
import { createPart } from '../../server/services/parts'
import { receiveInto } from '../../server/services/stock'
import { newLabelCode } from '../../server/services/codes'
import type { PartInput } from '../../shared/schemas/part'

/** A small invented store for tests that need exact figures: bins, one supplier, parts with stock. */
export async function smallStore(_userId?: number) {
  return inTransaction(async (tx) => {
    const workshop = await tx.save(Workshop, { name: 'Test bench workshop' })
    const rack = await tx.save(Rack, { code: 'T1', name: 'Test rack', workshopId: workshop.id })
    const bins: Bin[] = []
    for (let i = 1; i <= 4; i++) {
      bins.push(await tx.save(Bin, { code: `T1-0${i}`, labelCode: newLabelCode('B'), description: '', rackId: rack.id, retired: false, defaultPartId: null }))
    }
    const supplier = await tx.save(Supplier, { name: 'Calder Fixings (invented)', email: 'orders@calder.example', website: '', leadTimeDays: 4, notes: '' })
    return { workshop, bins, supplier }
  })
}

/** A part with an offer from `supplierId` and opening stock in `binId`. */
export async function stockedPart(input: PartInput, opts: { supplierId: number; binId: number; quantity: number; packSize: number; packPrice: number; userId: number; expiresOn?: string }) {
  return inTransaction(async (tx) => {
    const part = await createPart(tx, { ...input, preferredSupplierId: opts.supplierId })
    await tx.save(SupplierPart, { supplierId: opts.supplierId, partId: part.id, supplierCode: `CF-${part.id}`, packSize: opts.packSize, packPrice: opts.packPrice })
    if (opts.quantity > 0) {
      await receiveInto(tx, { partId: part.id, binId: opts.binId, quantity: opts.quantity, expiresOn: opts.expiresOn, reason: 'Opening stock' }, opts.userId)
    }
    return part
  })
}
