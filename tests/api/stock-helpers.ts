import { expect } from 'vitest'
import type { DataSource } from 'typeorm'
import { Bin, Movement, Part, StockLot } from '../../server/entities'

/** Lot quantities and the ledger's length: what a refused change must leave exactly as it was. */
export async function snapshot(ds: DataSource) {
  const lots = await ds.getRepository(StockLot).find({ order: { id: 'ASC' } })
  return {
    lots: lots.map((l) => [l.id, l.binId, l.quantity] as const),
    movements: await ds.getRepository(Movement).count(),
  }
}

export async function expectUnchanged(ds: DataSource, before: Awaited<ReturnType<typeof snapshot>>) {
  expect(await snapshot(ds)).toEqual(before)
}

export const partByCode = async (ds: DataSource, prefix: string) => {
  const parts = await ds.getRepository(Part).find()
  const part = parts.find((p) => p.code.startsWith(prefix))
  if (!part) throw new Error(`no demo part ${prefix}; have ${parts.map((p) => p.code).join(', ')}`)
  return part
}

export const binByCode = (ds: DataSource, code: string) => ds.getRepository(Bin).findOneByOrFail({ code })

/** Quantities of a part's lots in a bin, in lot order. */
export async function lotsIn(ds: DataSource, partId: number, binId: number) {
  return ds.getRepository(StockLot).find({ where: { partId, binId }, order: { id: 'ASC' } })
}

export const lastMovement = (ds: DataSource) =>
  ds.getRepository(Movement).find({ order: { id: 'DESC' }, take: 1 }).then((m) => m[0])

/** A demo part by words of its name (codes are suggested by the parts feature and may change). */
export const partNamed = async (ds: DataSource, words: string) => {
  const part = (await ds.getRepository(Part).find()).find((p) => p.name.startsWith(words))
  if (!part) throw new Error(`no demo part named ${words}`)
  return part
}
