import type { EntityManager } from 'typeorm'
import { Bin, Part, StockLot } from '../entities'
import { badRequest, conflict, forbidden, notFound } from '../errors'
import { QUANTITY_EPSILON } from './ledger'
import { roleAtLeast, type Role } from '../../shared/types/api'
import { stockModeOf } from '../../shared/types/domain'

/** A bin that exists and takes stock (not retired), read inside the transaction. */
export async function openBin(tx: EntityManager, binId: number): Promise<Bin> {
  const bin = await tx.findOneBy(Bin, { id: binId })
  if (!bin) throw notFound('The bin')
  if (bin.retired) throw conflict('BIN_RETIRED', `Bin ${bin.code} is retired and takes no stock.`)
  return bin
}

export async function activePart(tx: EntityManager, partId: number): Promise<Part> {
  const part = await tx.findOneBy(Part, { id: partId })
  if (!part) throw notFound('The part')
  if (part.archived) throw conflict('PART_ARCHIVED', `${part.code} is archived; restore it before moving stock.`)
  return part
}

/** A lot of the given part (when given), read inside the transaction. */
export async function lotOf(tx: EntityManager, lotId: number, partId?: number): Promise<StockLot> {
  const lot = await tx.findOneBy(StockLot, { id: lotId })
  if (!lot || (partId !== undefined && lot.partId !== partId)) throw notFound('The stock lot')
  return lot
}

/** Today as YYYY-MM-DD in the server's time zone: a batch is good through its expiry date. */
export const todayIso = (now = new Date()) =>
  new Date(now.getTime() - now.getTimezoneOffset() * 60_000).toISOString().slice(0, 10)

export const isExpired = (expiresOn: string | null, today = todayIso()) => !!expiresOn && expiresOn < today

/** Counted parts move in whole items; bar lengths and batch containers may not, checked here. */
export function assertWholeItems(part: Part, quantity: number) {
  if (stockModeOf(part.kind) === 'count' && !Number.isInteger(quantity)) {
    throw badRequest('WHOLE_ITEMS', `${part.code} is counted in whole items.`)
  }
}

/** Overrides (expired batch, reserved stock) are a storekeeper's call and need a reason. */
export function assertOverride(what: string, role: Role | undefined, reason: string | undefined) {
  if (role && !roleAtLeast(role, 'storekeeper')) throw forbidden(`Only a storekeeper may ${what}.`)
  if (!reason || reason.trim().length < 3) {
    throw badRequest('REASON_REQUIRED', `Give a reason to ${what}; it is recorded in the ledger.`)
  }
}

export const isZero = (n: number) => Math.abs(n) <= QUANTITY_EPSILON

/** Rounds for messages: bar lengths to 0.1 mm, counts as they are. */
export const show = (n: number) => String(Math.round(n * 1000) / 1000)
