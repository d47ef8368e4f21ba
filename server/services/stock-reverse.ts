import type { EntityManager } from 'typeorm'
import { Build, Movement } from '../entities'
import { conflict, notFound } from '../errors'
import { postMovement } from './ledger'
import { lotOf, openBin } from './stock-guards'

/** The ledger's reason column is 300 characters (Movement entity). */
const REASON_MAX = 300

/**
 * Undoes a mistaken movement by writing its opposite (same kind and quantity, lots swapped,
 * reversesId set). Refused when it would take a lot below zero, when the movement was already
 * reversed or is itself a reversal, and for build- or order-linked movements, whose build
 * lines and order lines must change with them (return them through the build or the order).
 */
export async function reverseMovement(tx: EntityManager, movementId: number, userId: number, reason = ''): Promise<Movement> {
  const m = await tx.findOneBy(Movement, { id: movementId })
  if (!m) throw notFound('The movement')
  if (m.reversesId) throw conflict('IS_REVERSAL', `Movement ${m.id} is itself a reversal of ${m.reversesId}; it cannot be reversed.`)
  const earlier = await tx.findOneBy(Movement, { reversesId: m.id })
  if (earlier) throw conflict('ALREADY_REVERSED', `Movement ${m.id} was already reversed by movement ${earlier.id}.`)
  if (m.buildId) {
    const build = await tx.findOneBy(Build, { id: m.buildId })
    throw conflict('BUILD_LINKED', `Movement ${m.id} belongs to the build "${build?.name ?? m.buildId}": `
      + 'return or release it from the build so its drawn quantities stay right.')
  }
  if (m.purchaseOrderId) {
    throw conflict('ORDER_LINKED', `Movement ${m.id} was received against purchase order ${m.purchaseOrderId}: correct it with an adjustment.`)
  }
  // Putting stock back into a lot needs its bin to be open.
  if (m.fromLotId) await openBin(tx, (await lotOf(tx, m.fromLotId)).binId)
  return postMovement(tx, {
    kind: m.kind, partId: m.partId, quantity: m.quantity,
    fromLotId: m.toLotId, toLotId: m.fromLotId,
    userId, reason: `Reverses movement ${m.id}${reason ? ': ' + reason : ''}`.slice(0, REASON_MAX), reversesId: m.id,
  })
}
