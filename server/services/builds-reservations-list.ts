import { In } from 'typeorm'
import { db } from '../db'
import { Build, BuildLine, Part, Reservation, User } from '../entities'
import type { Page } from '../../shared/types/api'
import type { ReservationDto } from '../../shared/types/build'

/** Which builds hold a part (the part page's panel), largest holding first. */
export async function listReservations(partId: number, page = 1, pageSize = 50): Promise<Page<ReservationDto>> {
  const m = db().manager
  const [rows, total] = await m.findAndCount(Reservation, {
    where: { partId }, order: { quantity: 'DESC', id: 'ASC' }, skip: (page - 1) * pageSize, take: pageSize,
  })
  const part = await m.findOneBy(Part, { id: partId })
  const builds = new Map((await m.findBy(Build, { id: In(rows.map((r) => r.buildId)) })).map((b) => [b.id, b]))
  const lines = new Map((await m.findBy(BuildLine, { id: In(rows.map((r) => r.buildLineId)) })).map((l) => [l.id, l]))
  const users = new Map((await m.findBy(User, { id: In(rows.map((r) => r.userId)) })).map((u) => [u.id, u]))
  const items = rows.map((r): ReservationDto => {
    const build = builds.get(r.buildId)
    return {
      id: r.id,
      partId: r.partId,
      buildId: r.buildId,
      buildName: build?.name ?? `Build ${r.buildId}`,
      buildStatus: build?.status ?? 'planned',
      buildLineId: r.buildLineId,
      lineNote: lines.get(r.buildLineId)?.note ?? '',
      quantity: r.quantity,
      unit: part?.unit ?? '',
      userName: users.get(r.userId)?.displayName ?? '',
      createdAt: r.createdAt.toISOString(),
    }
  })
  return { items, total, page, pageSize }
}
