import { In, MoreThan, type EntityManager } from 'typeorm'
import { db, inTransaction } from '../db'
import { Bin, Part, Rack, StockLot, Workshop } from '../entities'
import { conflict, notFound } from '../errors'
import { newLabelCode } from './codes'
import { isExpired, todayIso } from './stock-guards'
import { QUANTITY_EPSILON } from './ledger'
import { reservedTotals } from './stock-totals'
import {
  binCreateInput, binUpdateInput, rackInput, rackUpdateInput, workshopInput,
  type BinCreateInput, type BinUpdateInput, type RackInput, type WorkshopInput,
} from '../../shared/schemas/stock'
import type { BinContentsDto, BinDto, BinLineDto, PlaceTreeDto, RackDto, WorkshopDto } from '../../shared/types/stock'

function toBinDto(bin: Bin, rack: Rack, workshop: Workshop): BinDto {
  return {
    id: bin.id, code: bin.code, labelCode: bin.labelCode, description: bin.description,
    rackId: rack.id, rackCode: rack.code, rackName: rack.name,
    workshopId: workshop.id, workshopName: workshop.name, retired: bin.retired,
  }
}

/** GET /api/bins: every workshop, rack and bin, with how many stocked lots each bin holds. */
export async function placeTree(): Promise<PlaceTreeDto> {
  const m = db().manager
  const [workshops, racks, bins] = await Promise.all([
    m.find(Workshop, { order: { name: 'ASC' } }),
    m.find(Rack, { order: { code: 'ASC' } }),
    m.find(Bin, { order: { code: 'ASC' } }),
  ])
  const counts: { binId: number; n: number }[] = await m.createQueryBuilder(StockLot, 'l')
    .select('l.binId', 'binId').addSelect('COUNT(*)', 'n')
    .where('l.quantity > :eps', { eps: QUANTITY_EPSILON }).groupBy('l.binId').getRawMany()
  const lots = new Map(counts.map((c) => [Number(c.binId), Number(c.n)]))
  return {
    workshops: workshops.map((w) => ({
      id: w.id, name: w.name,
      racks: racks.filter((r) => r.workshopId === w.id).map((r) => ({
        id: r.id, code: r.code, name: r.name, workshopId: w.id,
        bins: bins.filter((b) => b.rackId === r.id).map((b) => ({ ...toBinDto(b, r, w), lots: lots.get(b.id) ?? 0 })),
      })),
    })),
  }
}

async function binDto(m: EntityManager, bin: Bin): Promise<BinDto> {
  const rack = await m.findOneByOrFail(Rack, { id: bin.rackId })
  return toBinDto(bin, rack, await m.findOneByOrFail(Workshop, { id: rack.workshopId }))
}

/** A bin by its human code (any case) or its label code. */
export async function findBinByCode(code: string, m: EntityManager = db().manager): Promise<Bin> {
  const wanted = code.trim().toUpperCase()
  const bin = await m.findOne(Bin, { where: [{ code: wanted }, { labelCode: wanted }] })
  if (!bin) throw notFound(`Bin ${code}`)
  return bin
}

/**
 * GET /api/bins/:code: the bin and every lot in it that holds stock, with part-level reservations.
 * The read every scanned label makes, so four statements: the bin with its rack and workshop
 * (joined), its lots, their parts, and their parts' reservations (on hand is not shown here).
 */
export async function binContents(code: string): Promise<BinContentsDto> {
  const m = db().manager
  const wanted = code.trim().toUpperCase()
  // find, not findOne: TypeORM pages a joined findOne with a second query.
  const found = await m.find(Bin, { where: [{ code: wanted }, { labelCode: wanted }], relations: { rack: { workshop: true } } })
  const bin = found.find((b) => b.code === wanted) ?? found[0]
  if (!bin) throw notFound(`Bin ${code}`)
  const lots = await m.find(StockLot, {
    where: { binId: bin.id, quantity: MoreThan(QUANTITY_EPSILON) }, order: { partId: 'ASC', expiresOn: 'ASC', quantity: 'DESC' },
  })
  const partIds = [...new Set(lots.map((l) => l.partId))]
  const parts = new Map((partIds.length ? await m.findBy(Part, { id: In(partIds) }) : []).map((p) => [p.id, p]))
  // Only reservations: stockTotals would add an on-hand query the bin page does not show.
  const reserved = await reservedTotals(partIds, m)
  const today = todayIso()
  const lines: BinLineDto[] = lots.map((l) => {
    const p = parts.get(l.partId)!
    return {
      lotId: l.id, partId: p.id, partCode: p.code, partName: p.name, kind: p.kind, unit: p.unit,
      quantity: l.quantity, reserved: reserved.get(p.id) ?? 0,
      batchCode: l.batchCode, expiresOn: l.expiresOn, expired: isExpired(l.expiresOn, today),
      pressureBearing: p.pressureBearing, hazardous: p.attributes?.hazardous === true,
    }
  })
  return { bin: toBinDto(bin, bin.rack, bin.rack.workshop), lines }
}

async function assertFreeBinCode(m: EntityManager, code: string, exceptId?: number) {
  const other = await m.findOne(Bin, { where: [{ code }, { labelCode: code }] })
  if (other && other.id !== exceptId) throw conflict('CODE_TAKEN', `There is already a bin ${code}.`)
}

export const createBin = (raw: BinCreateInput) => inTransaction(async (tx) => {
  const input = binCreateInput.parse(raw)
  if (!(await tx.findOneBy(Rack, { id: input.rackId }))) throw notFound('The rack')
  await assertFreeBinCode(tx, input.code)
  const bin = await tx.save(Bin, {
    code: input.code, labelCode: newLabelCode('B'), description: input.description,
    rackId: input.rackId, defaultPartId: null, retired: false,
  })
  return binDto(tx, bin)
})

/** Rename, describe, move to another rack or set the default part; the label code never changes. */
export const updateBin = (id: number, raw: BinUpdateInput) => inTransaction(async (tx) => {
  const input = binUpdateInput.parse(raw)
  const bin = await tx.findOneBy(Bin, { id })
  if (!bin) throw notFound('The bin')
  if (input.code && input.code !== bin.code) await assertFreeBinCode(tx, input.code, id)
  if (input.rackId && !(await tx.findOneBy(Rack, { id: input.rackId }))) throw notFound('The rack')
  if (input.defaultPartId && !(await tx.findOneBy(Part, { id: input.defaultPartId }))) throw notFound('The part')
  Object.assign(bin, Object.fromEntries(Object.entries(input).filter(([, v]) => v !== undefined)))
  return binDto(tx, await tx.save(Bin, bin))
})

/** Retires an empty bin (stock must be moved out first); it then takes no stock. */
export const setBinRetired = (id: number, retired: boolean) => inTransaction(async (tx) => {
  const bin = await tx.findOneBy(Bin, { id })
  if (!bin) throw notFound('The bin')
  if (retired) {
    const stocked = await tx.countBy(StockLot, { binId: id, quantity: MoreThan(QUANTITY_EPSILON) })
    if (stocked) throw conflict('BIN_NOT_EMPTY', `Bin ${bin.code} still holds ${stocked} lot(s) of stock: move or count them out first.`)
  }
  bin.retired = retired
  return binDto(tx, await tx.save(Bin, bin))
})

const rackDto = (r: Rack): RackDto => ({ id: r.id, code: r.code, name: r.name, workshopId: r.workshopId })
const workshopDto = (w: Workshop): WorkshopDto => ({ id: w.id, name: w.name })

export const createRack = (raw: RackInput) => inTransaction(async (tx) => {
  const input = rackInput.parse(raw)
  if (!(await tx.findOneBy(Workshop, { id: input.workshopId }))) throw notFound('The workshop')
  if (await tx.findOneBy(Rack, { code: input.code })) throw conflict('CODE_TAKEN', `There is already a rack ${input.code}.`)
  return rackDto(await tx.save(Rack, input))
})

export const updateRack = (id: number, raw: Partial<RackInput>) => inTransaction(async (tx) => {
  const input = rackUpdateInput.parse(raw)
  const rack = await tx.findOneBy(Rack, { id })
  if (!rack) throw notFound('The rack')
  if (input.code && input.code !== rack.code && await tx.findOneBy(Rack, { code: input.code })) {
    throw conflict('CODE_TAKEN', `There is already a rack ${input.code}.`)
  }
  if (input.workshopId && !(await tx.findOneBy(Workshop, { id: input.workshopId }))) throw notFound('The workshop')
  Object.assign(rack, Object.fromEntries(Object.entries(input).filter(([, v]) => v !== undefined)))
  return rackDto(await tx.save(Rack, rack))
})

export const createWorkshop = (raw: WorkshopInput) => inTransaction(async (tx) => {
  const input = workshopInput.parse(raw)
  if (await tx.findOneBy(Workshop, { name: input.name })) throw conflict('NAME_TAKEN', `There is already a workshop "${input.name}".`)
  return workshopDto(await tx.save(Workshop, input))
})

export const renameWorkshop = (id: number, raw: WorkshopInput) => inTransaction(async (tx) => {
  const input = workshopInput.parse(raw)
  const w = await tx.findOneBy(Workshop, { id })
  if (!w) throw notFound('The workshop')
  const other = await tx.findOneBy(Workshop, { name: input.name })
  if (other && other.id !== id) throw conflict('NAME_TAKEN', `There is already a workshop "${input.name}".`)
  w.name = input.name
  return workshopDto(await tx.save(Workshop, w))
})
