import { Brackets, In, type EntityManager, type SelectQueryBuilder } from 'typeorm'
import Papa from 'papaparse'
import { db } from '../db'
import { Bin, Build, Movement, Part, StockLot, User } from '../entities'
import { movementQuery, type MovementQuery } from '../../shared/schemas/stock'
import type { MovementDto } from '../../shared/types/stock'
import type { Page } from '../../shared/types/api'

/** CSV export cap: a club's ledger over years stays far below it; past it, narrow the dates. */
export const EXPORT_MAX_ROWS = 100_000

const byId = async <T extends { id: number }>(m: EntityManager, entity: new () => T, ids: (number | null)[]) => {
  const wanted = [...new Set(ids.filter((i): i is number => i !== null))]
  const rows = wanted.length ? await m.findBy(entity, { id: In(wanted) } as never) : []
  return new Map(rows.map((r) => [r.id, r]))
}

/** Maps ledger rows to DTOs with one query per related table (no N+1). */
export async function toMovementDtos(movements: Movement[], tx?: EntityManager): Promise<MovementDto[]> {
  const m = tx ?? db().manager
  const [parts, bins, builds, users, lots] = await Promise.all([
    byId(m, Part, movements.map((x) => x.partId)),
    byId(m, Bin, movements.flatMap((x) => [x.fromBinId, x.toBinId])),
    byId(m, Build, movements.map((x) => x.buildId)),
    byId(m, User, movements.map((x) => x.userId)),
    byId(m, StockLot, movements.map((x) => x.fromLotId ?? x.toLotId)),
  ])
  const ids = movements.map((x) => x.id)
  const reversals = ids.length
    ? await m.find(Movement, { select: { id: true, reversesId: true }, where: { reversesId: In(ids) } })
    : []
  const reversedBy = new Map(reversals.map((r) => [r.reversesId!, r.id]))
  return movements.map((x) => {
    const part = parts.get(x.partId)
    return {
      id: x.id, kind: x.kind, at: new Date(x.at).toISOString(),
      partId: x.partId, partCode: part?.code ?? '', partName: part?.name ?? '', quantity: x.quantity, unit: part?.unit ?? '',
      fromLotId: x.fromLotId, toLotId: x.toLotId,
      fromBinCode: x.fromBinId ? bins.get(x.fromBinId)?.code ?? null : null,
      toBinCode: x.toBinId ? bins.get(x.toBinId)?.code ?? null : null,
      batchCode: lots.get((x.fromLotId ?? x.toLotId)!)?.batchCode ?? null,
      buildId: x.buildId, buildName: x.buildId ? builds.get(x.buildId)?.name ?? null : null,
      purchaseOrderId: x.purchaseOrderId,
      userId: x.userId, userName: users.get(x.userId)?.displayName ?? '',
      reason: x.reason, reversesId: x.reversesId, reversedById: reversedBy.get(x.id) ?? null,
    }
  })
}

/** The ledger filtered as GET /api/movements asks, newest first. */
function filtered(q: ReturnType<typeof movementQuery.parse>): SelectQueryBuilder<Movement> {
  const qb = db().getRepository(Movement).createQueryBuilder('m')
  if (q.part) qb.andWhere('m.partId = :part', { part: q.part })
  if (q.bin) qb.andWhere(new Brackets((w) => w.where('m.fromBinId = :bin', { bin: q.bin }).orWhere('m.toBinId = :bin', { bin: q.bin })))
  if (q.user) qb.andWhere('m.userId = :user', { user: q.user })
  if (q.kind) qb.andWhere('m.kind = :kind', { kind: q.kind })
  if (q.build) qb.andWhere('m.buildId = :build', { build: q.build })
  if (q.purchaseOrder) qb.andWhere('m.purchaseOrderId = :po', { po: q.purchaseOrder })
  // Dates are whole days, both ends included; timestamps are stored as UTC 'YYYY-MM-DD hh:mm:ss'.
  if (q.from) qb.andWhere('m.at >= :from', { from: `${q.from} 00:00:00` })
  if (q.to) qb.andWhere('m.at <= :to', { to: `${q.to} 23:59:59.999` })
  return qb.orderBy('m.id', 'DESC')
}

export async function listMovements(raw: MovementQuery): Promise<Page<MovementDto>> {
  const q = movementQuery.parse(raw)
  const [rows, total] = await filtered(q).skip((q.page - 1) * q.pageSize).take(q.pageSize).getManyAndCount()
  return { items: await toMovementDtos(rows), total, page: q.page, pageSize: q.pageSize }
}

/**
 * The filtered ledger as CSV (one header row, ISO timestamps, quantities in the part's unit).
 * Cells starting with = + - @ are quoted so a spreadsheet does not run them as formulae.
 */
export async function exportMovementsCsv(raw: MovementQuery): Promise<string> {
  const q = movementQuery.parse(raw)
  const rows = await toMovementDtos(await filtered(q).take(EXPORT_MAX_ROWS).getMany())
  return Papa.unparse(rows.map((r) => ({
    id: r.id, at: r.at, kind: r.kind, part_code: r.partCode, part_name: r.partName,
    quantity: r.quantity, unit: r.unit, from_bin: r.fromBinCode ?? '', to_bin: r.toBinCode ?? '',
    batch: r.batchCode ?? '', build: r.buildName ?? '', purchase_order: r.purchaseOrderId ?? '',
    user: r.userName, reason: r.reason, reverses: r.reversesId ?? '',
  })), { columns: CSV_COLUMNS, escapeFormulae: true })
}

const CSV_COLUMNS = ['id', 'at', 'kind', 'part_code', 'part_name', 'quantity', 'unit', 'from_bin', 'to_bin',
  'batch', 'build', 'purchase_order', 'user', 'reason', 'reverses']

/** Everyone who has written to the ledger, for the ledger's "who" filter (viewers cannot list users). */
export async function ledgerPeople(): Promise<{ id: number; displayName: string }[]> {
  return db().getRepository(User).createQueryBuilder('u')
    .select(['u.id', 'u.displayName'])
    .where('u.id IN (SELECT DISTINCT m."userId" FROM movements m)')
    .orderBy('u.displayName').getMany()
    .then((users) => users.map((u) => ({ id: u.id, displayName: u.displayName })))
}
