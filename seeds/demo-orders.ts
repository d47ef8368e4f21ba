import { inTransaction } from '../server/db'
import { Part, PurchaseOrder, Supplier, SupplierPart, User } from '../server/entities'
import { createOrder } from '../server/services/orders'

const MS_PER_DAY = 86_400_000
const isoDay = (daysFromNow: number) => new Date(Date.now() + daysFromNow * MS_PER_DAY).toISOString().slice(0, 10)

/**
 * A second (invented) supplier, a metal stockholder, and one order sent to it that is now two
 * days late, so Today's orders box and the receive dialog have something to show.
 */
export async function seedDemoOrders() {
  const { keeperId, round, supplierId } = await inTransaction(async (tx) => {
    const supplier = await tx.save(Supplier, {
      name: 'Brassworks Metal Stockholders (invented)', email: 'sales@brassworks-metals.example',
      website: 'https://brassworks-metals.example', leadTimeDays: 10, notes: 'Cuts bar to length; metre lengths by post.',
    })
    const part = (name: string) => tx.findOneByOrFail(Part, { name })
    const [round, hex, bronze] = await Promise.all([
      part('brass round bar 9.525 mm'), part('brass hex bar 6.35 mm'), part('phosphor bronze round bar 16 mm'),
    ])
    // Prices per 1000 mm (or 500 mm) length: invented, in the workshop's currency.
    await tx.save(SupplierPart, [
      { supplierId: supplier.id, partId: round.id, supplierCode: 'BR-R-3/8', packSize: 1000, packPrice: 18 },
      { supplierId: supplier.id, partId: hex.id, supplierCode: 'BR-H-1/4', packSize: 1000, packPrice: 14 },
      { supplierId: supplier.id, partId: bronze.id, supplierCode: 'PB-R-16', packSize: 500, packPrice: 21 },
    ])
    const keeper = await tx.findOneByOrFail(User, { username: 'keeper' })
    return { keeperId: keeper.id, round, supplierId: supplier.id }
  })
  const order = await createOrder({ supplierId, lines: [{ partId: round.id, packs: 2 }], notes: 'For the junior section\'s oscillating engines.' }, keeperId)
  // Sent twelve days ago with a ten-day lead time: two days late. (The seed sends no e-mail.)
  await inTransaction((tx) => tx.update(PurchaseOrder, { id: order.id }, {
    status: 'sent', sentAt: new Date(Date.now() - 12 * MS_PER_DAY).toISOString(), expectedOn: isoDay(-2),
  }))
}
