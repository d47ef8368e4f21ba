import { z } from 'zod'
import type { EntityManager } from 'typeorm'
import {
  Attachment, BuildLine, Movement, Part, PurchaseLine, Reservation, StockLot, SupplierPart,
} from '../entities'
import { db, inTransaction } from '../db'
import { conflict, notFound } from '../errors'
import { checkedAttributes, createPart, freeCode, suggestPartCode, updatePart } from './parts'
import { afterCatalogueWrite, partsChanged } from './part-search-index'
import { toPartDetail } from './part-summaries'
import { partAttributes, type PartInput } from '../../shared/schemas/part'
import type { PartDetailDto } from '../../shared/types/part'

/** The part or 404 (through the caller's transaction when given). */
export async function findPart(id: number, tx?: EntityManager): Promise<Part> {
  const part = await (tx ?? db().manager).findOneBy(Part, { id })
  if (!part) throw notFound(`Part ${id}`)
  return part
}

export const partDetail = async (id: number) => toPartDetail(await findPart(id))

export async function partByLabel(labelCode: string): Promise<PartDetailDto> {
  const part = await db().manager.findOneBy(Part, { labelCode: labelCode.trim().toUpperCase() })
  if (!part) throw notFound(`A part with label ${labelCode}`)
  return toPartDetail(part)
}

export const createPartRecord = (input: PartInput) =>
  afterCatalogueWrite([], (written) => inTransaction(async (tx) => {
    const part = await createPart(tx, input)
    written.push(part.id)
    return toPartDetail(part, tx)
  }))

export const updatePartRecord = (id: number, input: PartInput) =>
  afterCatalogueWrite([id], () => inTransaction(async (tx) => {
    const part = await findPart(id, tx)
    const kindLocked = await tx.existsBy(Movement, { partId: id }) || await tx.existsBy(StockLot, { partId: id })
    return toPartDetail(await updatePart(tx, part, input, { kindLocked }), tx)
  }))

/** Archived parts leave lists and search but keep their ledger; restoring brings them back. */
export const setArchived = (id: number, archived: boolean) =>
  afterCatalogueWrite([id], () => inTransaction(async (tx) => {
    const part = await findPart(id, tx)
    part.archived = archived
    await tx.save(Part, part)
    // The word index holds archived parts too (search filters them in SQL), but cached answers must go.
    partsChanged([id])
    return toPartDetail(part, tx)
  }))

/** Records that refer to a part; any of them means it can only be archived, never deleted. */
const REFERENCES = [
  [Movement, 'ledger movements'], [StockLot, 'stock'], [BuildLine, 'build lines'], [Reservation, 'reservations'],
  [SupplierPart, 'supplier entries'], [PurchaseLine, 'purchase order lines'],
] as const

/** Deletes a part entered by mistake; one with a ledger, stock or other records is refused (archive it). */
export const deletePart = (id: number) =>
  afterCatalogueWrite([id], () => inTransaction(async (tx) => {
    const part = await findPart(id, tx)
    const used: string[] = []
    for (const [entity, what] of REFERENCES) if (await tx.existsBy(entity, { partId: id })) used.push(what)
    if (await tx.existsBy(Attachment, { ownerType: 'part', ownerId: id })) used.push('drawings')
    if (used.length) {
      throw conflict('PART_IN_USE', `${part.code} has ${used.join(', ')}: archive it instead, so its history stays.`, { used })
    }
    await tx.delete(Part, { id })
    partsChanged([id])
  }))

export const suggestCodeInput = z.object({ name: z.string().trim().max(200).default(''), attributes: partAttributes, exceptId: z.number().int().positive().optional() })

/** POST /api/parts/suggest-code: a free code from the attributes ("7BA-STUD-12-BR", or "-2" when taken). */
export async function suggestCode(raw: unknown): Promise<{ code: string }> {
  const input = suggestCodeInput.parse(raw)
  const attributes = checkedAttributes(input.attributes)
  return { code: await freeCode(db().manager, suggestPartCode(attributes, input.name), input.exceptId) }
}
