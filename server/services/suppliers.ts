import { ILike, In, type EntityManager } from 'typeorm'
import { db, inTransaction } from '../db'
import { Part, PurchaseOrder, Supplier, SupplierPart } from '../entities'
import { conflict, notFound } from '../errors'
import {
  offerInput, offerPatch, supplierInput, supplierPatch,
  type OfferInput, type OfferPatch, type SupplierInput, type SupplierPatch,
} from '../../shared/schemas/supplier'
import type { Page } from '../../shared/types/api'
import type { SupplierDetailDto, SupplierDto, SupplierOfferDto } from '../../shared/types/supplier'

type Manager = EntityManager

async function offerCounts(m: Manager, ids: number[]): Promise<Map<number, number>> {
  if (!ids.length) return new Map()
  const rows: { supplierId: number; n: number }[] = await m.createQueryBuilder(SupplierPart, 'o')
    .select('o.supplierId', 'supplierId').addSelect('COUNT(*)', 'n')
    .where({ supplierId: In(ids) }).groupBy('o.supplierId').getRawMany()
  return new Map(rows.map((r) => [Number(r.supplierId), Number(r.n)]))
}

const toSupplierDto = (s: Supplier, offerCount: number): SupplierDto => ({
  id: s.id, name: s.name, email: s.email, website: s.website, leadTimeDays: s.leadTimeDays, notes: s.notes, offerCount,
})

export async function listSuppliers(q: string | undefined, page: number, pageSize: number): Promise<Page<SupplierDto>> {
  const m = db().manager
  const where = q ? { name: ILike(`%${q}%`) } : {}
  const [rows, total] = await m.findAndCount(Supplier, { where, order: { name: 'ASC' }, skip: (page - 1) * pageSize, take: pageSize })
  const counts = await offerCounts(m, rows.map((s) => s.id))
  return { items: rows.map((s) => toSupplierDto(s, counts.get(s.id) ?? 0)), total, page, pageSize }
}

/** Offers as DTOs, with part and supplier names, in two extra queries (no N+1). */
export async function toOfferDtos(m: Manager, offers: SupplierPart[]): Promise<SupplierOfferDto[]> {
  if (!offers.length) return []
  const parts = new Map((await m.findBy(Part, { id: In(offers.map((o) => o.partId)) })).map((p) => [p.id, p]))
  const suppliers = new Map((await m.findBy(Supplier, { id: In(offers.map((o) => o.supplierId)) })).map((s) => [s.id, s]))
  return offers.map((o) => {
    const part = parts.get(o.partId)
    const supplier = suppliers.get(o.supplierId)
    return {
      id: o.id, supplierId: o.supplierId, supplierName: supplier?.name ?? '?', partId: o.partId,
      partCode: part?.code ?? '?', partName: part?.name ?? '?', unit: part?.unit ?? '',
      supplierCode: o.supplierCode, packSize: o.packSize, packPrice: o.packPrice,
      unitPrice: o.packSize > 0 ? o.packPrice / o.packSize : 0,
      leadTimeDays: supplier?.leadTimeDays ?? 0, preferred: part?.preferredSupplierId === o.supplierId,
    }
  })
}

export async function getSupplier(id: number, m: Manager = db().manager): Promise<SupplierDetailDto> {
  const s = await m.findOneBy(Supplier, { id })
  if (!s) throw notFound('The supplier')
  const offers = await m.find(SupplierPart, { where: { supplierId: id }, order: { id: 'ASC' } })
  const dtos = (await toOfferDtos(m, offers)).sort((a, b) => a.partCode.localeCompare(b.partCode))
  return { ...toSupplierDto(s, offers.length), offers: dtos }
}

async function uniqueName(tx: Manager, name: string, exceptId?: number) {
  const other = await tx.findOneBy(Supplier, { name })
  if (other && other.id !== exceptId) throw conflict('NAME_TAKEN', `There is already a supplier called ${name}.`)
}

export const createSupplier = (raw: SupplierInput) => inTransaction(async (tx) => {
  const input = supplierInput.parse(raw)
  await uniqueName(tx, input.name)
  const s = await tx.save(Supplier, tx.create(Supplier, input))
  return getSupplier(s.id, tx)
})

export const updateSupplier = (id: number, raw: SupplierPatch) => inTransaction(async (tx) => {
  const input = supplierPatch.parse(raw)
  const s = await tx.findOneBy(Supplier, { id })
  if (!s) throw notFound('The supplier')
  if (input.name) await uniqueName(tx, input.name, id)
  await tx.save(Supplier, Object.assign(s, input))
  return getSupplier(id, tx)
})

/** A supplier with orders stays (the orders name it); one without is removed with its offers. */
export const deleteSupplier = (id: number) => inTransaction(async (tx) => {
  const s = await tx.findOneBy(Supplier, { id })
  if (!s) throw notFound('The supplier')
  const orders = await tx.countBy(PurchaseOrder, { supplierId: id })
  if (orders) throw conflict('SUPPLIER_HAS_ORDERS', `${s.name} has ${orders} purchase order(s); it is kept so they still name it.`)
  await tx.delete(SupplierPart, { supplierId: id })
  await tx.update(Part, { preferredSupplierId: id }, { preferredSupplierId: null })
  await tx.delete(Supplier, { id })
})

export const addOffer = (supplierId: number, raw: OfferInput) => inTransaction(async (tx) => {
  const input = offerInput.parse(raw)
  if (!(await tx.existsBy(Supplier, { id: supplierId }))) throw notFound('The supplier')
  const part = await tx.findOneBy(Part, { id: input.partId })
  if (!part) throw notFound('The part')
  if (await tx.existsBy(SupplierPart, { supplierId, partId: input.partId })) {
    throw conflict('OFFER_EXISTS', `This supplier already offers ${part.code}; change that offer instead.`)
  }
  const offer = await tx.save(SupplierPart, tx.create(SupplierPart, { supplierId, ...input }))
  // The first supplier of a part becomes its preferred one; a storekeeper can change that.
  if (!part.preferredSupplierId) await tx.update(Part, { id: part.id }, { preferredSupplierId: supplierId })
  return (await toOfferDtos(tx, [offer]))[0]
})

async function offerOf(tx: Manager, supplierId: number, offerId: number) {
  const offer = await tx.findOneBy(SupplierPart, { id: offerId, supplierId })
  if (!offer) throw notFound('The offer')
  return offer
}

export const updateOffer = (supplierId: number, offerId: number, raw: OfferPatch) => inTransaction(async (tx) => {
  const offer = Object.assign(await offerOf(tx, supplierId, offerId), offerPatch.parse(raw))
  await tx.save(SupplierPart, offer)
  return (await toOfferDtos(tx, [offer]))[0]
})

export const removeOffer = (supplierId: number, offerId: number) => inTransaction(async (tx) => {
  const offer = await offerOf(tx, supplierId, offerId)
  await tx.delete(SupplierPart, { id: offer.id })
  await tx.update(Part, { id: offer.partId, preferredSupplierId: supplierId }, { preferredSupplierId: null })
})
