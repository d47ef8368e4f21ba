import { In, MoreThan, type EntityManager } from 'typeorm'
import { db } from '../db'
import { Bin, Part, StockLot } from '../entities'
import { QUANTITY_EPSILON } from './ledger'
import { cautionsOf } from '../../shared/domain/cautions'
import { labelSelection, type LabelSelection } from '../../shared/schemas/labels'
import type { LabelItemDto, LabelItemsDto } from '../../shared/types/labels'

/** The URL a bin's QR label carries; its page accepts the label code or the human code. */
export const binLabelUrl = (publicUrl: string, labelCode: string) => `${publicUrl}/bins/${encodeURIComponent(labelCode)}`
/** The URL a part's QR label carries; the client resolves it to the part's page. */
export const partLabelUrl = (publicUrl: string, labelCode: string) => `${publicUrl}/parts/by-label/${encodeURIComponent(labelCode)}`

/** The labels of the chosen bins or parts, in the order chosen (rack bins by code). */
export async function labelItems(raw: LabelSelection, publicUrl: string, m: EntityManager = db().manager): Promise<LabelItemsDto> {
  const sel = labelSelection.parse(raw)
  return sel.kind === 'bin' ? binItems(m, sel, publicUrl) : partItems(m, sel, publicUrl)
}

type Sel = ReturnType<typeof labelSelection.parse>

const upper = (codes: string[]) => codes.map((c) => c.toUpperCase())

async function binItems(m: EntityManager, sel: Sel, publicUrl: string): Promise<LabelItemsDto> {
  const codes = upper(sel.codes)
  const [byId, byCode, byRack] = await Promise.all([
    sel.ids.length ? m.findBy(Bin, { id: In(sel.ids) }) : [],
    codes.length ? m.find(Bin, { where: [{ code: In(codes) }, { labelCode: In(codes) }] }) : [],
    sel.rackId ? m.find(Bin, { where: { rackId: sel.rackId, retired: false }, order: { code: 'ASC' } }) : [],
  ])
  const ordered = [
    ...orderBy(byId, sel.ids, (b) => [b.id]),
    ...orderBy(byCode, codes, (b) => [b.code, b.labelCode]),
    ...byRack,
  ]
  const bins = unique(ordered)
  const lots = bins.length ? await m.findBy(StockLot, { binId: In(bins.map((b) => b.id)), quantity: MoreThan(QUANTITY_EPSILON) }) : []
  const partIds = new Set([...lots.map((l) => l.partId), ...bins.flatMap((b) => (b.defaultPartId ? [b.defaultPartId] : []))])
  const parts = new Map((partIds.size ? await m.findBy(Part, { id: In([...partIds]) }) : []).map((p) => [p.id, p]))
  const items = bins.map((bin): LabelItemDto => {
    const inBin = [...new Set(lots.filter((l) => l.binId === bin.id).map((l) => l.partId))].map((id) => parts.get(id)!)
    const main = (bin.defaultPartId ? parts.get(bin.defaultPartId) : undefined) ?? (inBin.length === 1 ? inBin[0] : undefined)
    const all = unique([...(main ? [main] : []), ...inBin])
    return {
      kind: 'bin', id: bin.id, code: bin.code, labelCode: bin.labelCode, url: binLabelUrl(publicUrl, bin.labelCode),
      name: main?.name ?? (bin.description || (inBin.length ? `${inBin.length} parts` : '')),
      detail: main ? describePart(main) : '',
      cautions: [...new Set(all.flatMap((p) => cautionsOf(partFlags(p))))],
    }
  })
  return { items, unknownCodes: codes.filter((c) => !byCode.some((b) => b.code === c || b.labelCode === c)) }
}

async function partItems(m: EntityManager, sel: Sel, publicUrl: string): Promise<LabelItemsDto> {
  const codes = upper(sel.codes)
  const [byId, byCode] = await Promise.all([
    sel.ids.length ? m.findBy(Part, { id: In(sel.ids) }) : [],
    codes.length ? m.find(Part, { where: [{ code: In(codes) }, { labelCode: In(codes) }] }) : [],
  ])
  const parts = unique([...orderBy(byId, sel.ids, (p) => [p.id]), ...orderBy(byCode, codes, (p) => [p.code, p.labelCode])])
  const items = parts.map((p): LabelItemDto => ({
    kind: 'part', id: p.id, code: p.code, labelCode: p.labelCode, url: partLabelUrl(publicUrl, p.labelCode),
    name: p.name, detail: describePart(p), cautions: cautionsOf(partFlags(p)),
  }))
  return { items, unknownCodes: codes.filter((c) => !byCode.some((p) => p.code === c || p.labelCode === c)) }
}

export const partFlags = (p: Part) => ({ pressureBearing: p.pressureBearing, hazardous: p.kind === 'compound' && p.attributes.hazardous === true })

const mm = (n: unknown) => (typeof n === 'number' ? `${Math.round(n * 100) / 100} mm` : '')

/** The size line of a label: "7BA × 12 mm stud", "hex 6.35 mm", "0.4 mm thick", "10 ml". */
export function describePart(p: Part): string {
  const a = p.attributes
  switch (p.kind) {
    case 'fastener':
      return [a.thread, a.lengthMm ? `× ${mm(a.lengthMm)}` : '', a.type].filter(Boolean).join(' ')
    case 'stock':
      return [a.section, a.wallMm ? `${mm(a.sizeMm).replace(' mm', '')} × ${mm(a.wallMm)}` : mm(a.sizeMm)].filter(Boolean).join(' ')
    case 'gasket':
      return a.thicknessMm ? `${mm(a.thicknessMm)} thick` : ''
    case 'compound':
      return typeof a.containerSize === 'string' ? a.containerSize : ''
    default:
      return ''
  }
}

/** Rows in the order their keys were asked for (a row matches by any of its keys). */
function orderBy<T>(rows: T[], keys: (string | number)[], keysOf: (row: T) => (string | number)[]): T[] {
  return keys.flatMap((k) => rows.filter((r) => keysOf(r).includes(k)).slice(0, 1))
}

function unique<T extends { id: number }>(rows: T[]): T[] {
  const seen = new Set<number>()
  return rows.filter((r) => !seen.has(r.id) && !!seen.add(r.id))
}
