import { In, MoreThan } from 'typeorm'
import { db } from '../db'
import { Build, BuildLine, Part } from '../entities'
import { stockTotals } from './stock-totals'
import { BOM_EPSILON } from '../../shared/domain/bom'
import type { Page } from '../../shared/types/api'
import type { ShortageDto } from '../../shared/types/build'

/** Builds whose shortages count: planned and active ones (finished and shelved hold nothing). */
export const OPEN_BUILD_STATUSES = ['planned', 'active'] as const

export interface OpenShortage {
  partId: number
  buildId: number
  buildName: string
  lineId: number
  shortQuantity: number
}

/**
 * Every recorded shortage on an open build, for the reorder suggestions (orders) and the
 * shortage lists. Quantities are in the part's stock unit (items, mm of bar, containers).
 */
export async function openShortages(): Promise<OpenShortage[]> {
  const m = db().manager
  const builds = await m.find(Build, { where: { status: In([...OPEN_BUILD_STATUSES]) } })
  if (!builds.length) return []
  const names = new Map(builds.map((b) => [b.id, b.name]))
  const lines = await m.find(BuildLine, {
    where: { buildId: In(builds.map((b) => b.id)), shortQuantity: MoreThan(BOM_EPSILON) },
    order: { buildId: 'ASC', position: 'ASC', id: 'ASC' },
  })
  return lines.map((l) => ({
    partId: l.partId, buildId: l.buildId, buildName: names.get(l.buildId) ?? '', lineId: l.id, shortQuantity: l.shortQuantity,
  }))
}

/** GET /api/shortages: the open shortages with part names and today's free stock, a page at a time. */
export async function listShortages(page = 1, pageSize = 100, buildId?: number): Promise<Page<ShortageDto>> {
  const all = (await openShortages()).filter((s) => buildId === undefined || s.buildId === buildId)
  const slice = all.slice((page - 1) * pageSize, page * pageSize)
  const m = db().manager
  const parts = new Map((await m.findBy(Part, { id: In(slice.map((s) => s.partId)) })).map((p) => [p.id, p]))
  const totals = await stockTotals(slice.map((s) => s.partId))
  const items = slice.map((s): ShortageDto => {
    const p = parts.get(s.partId)!
    return {
      ...s, partCode: p.code, partName: p.name, unit: p.unit,
      shortQuantity: Math.round(s.shortQuantity * 1000) / 1000,
      available: Math.round((totals.get(s.partId)?.available ?? 0) * 1000) / 1000,
    }
  })
  return { items, total: all.length, page, pageSize }
}
