import { ILike, In, type EntityManager, type FindOptionsWhere } from 'typeorm'
import { db, inTransaction, touchPart } from '../db'
import { Build, BuildLine, Part, Reservation, User } from '../entities'
import { badRequest, conflict, forbidden } from '../errors'
import { buildOr404, editableBuild, type Actor } from './builds-access'
import { toDetail, toSummaries } from './builds-view'
import { roleAtLeast, type Page } from '../../shared/types/api'
import {
  buildInput, buildListQuery, buildPatch, statusInput,
  type BuildInput, type BuildPatch, type StatusInput,
} from '../../shared/schemas/build'
import type { BuildDetailDto, BuildSummaryDto, ReleasePreviewDto } from '../../shared/types/build'
import type { z } from 'zod'

/** Statuses in which a build holds nothing: moving there releases its reservations. */
const CLOSING = new Set(['finished', 'shelved'])

export async function listBuilds(q: z.infer<typeof buildListQuery>, actor: Actor): Promise<Page<BuildSummaryDto>> {
  const where: FindOptionsWhere<Build> = {
    ...(q.status ? { status: q.status } : {}),
    ...(q.mine ? { ownerId: actor.id } : {}),
    ...(q.q ? { name: ILike(`%${q.q.replace(/[%_]/g, '')}%`) } : {}),
  }
  const m = db().manager
  const [builds, total] = await m.findAndCount(Build, {
    where, order: { updatedAt: 'DESC', id: 'DESC' }, skip: (q.page - 1) * q.pageSize, take: q.pageSize,
  })
  return { items: await toSummaries(m, builds), total, page: q.page, pageSize: q.pageSize }
}

export async function getBuild(id: number, actor: Actor): Promise<BuildDetailDto> {
  const m = db().manager
  return toDetail(m, await buildOr404(m, id), actor)
}

/** A storekeeper may give a build to another member; builders own what they open. */
async function ownerFor(m: EntityManager, ownerId: number | undefined, actor: Actor) {
  if (ownerId === undefined || ownerId === actor.id) return actor.id
  if (!roleAtLeast(actor.role, 'storekeeper')) throw forbidden('Only a storekeeper or an admin may give a build to someone else.')
  const owner = await m.findOneBy(User, { id: ownerId, active: true })
  if (!owner || owner.role === 'viewer') throw badRequest('BAD_OWNER', 'The owner must be an active member who may build.')
  return owner.id
}

export async function createBuild(raw: BuildInput, actor: Actor): Promise<BuildDetailDto> {
  const input = buildInput.parse(raw)
  return inTransaction(async (tx) => {
    const ownerId = await ownerFor(tx, input.ownerId, actor)
    const build = await tx.save(Build, tx.create(Build, {
      name: input.name, description: input.description, targetDate: input.targetDate, ownerId, status: 'planned',
    }))
    return toDetail(tx, build, actor)
  })
}

export async function updateBuild(id: number, raw: BuildPatch, actor: Actor): Promise<BuildDetailDto> {
  const input = buildPatch.parse(raw)
  return inTransaction(async (tx) => {
    const build = await editableBuild(tx, id, actor)
    if (input.ownerId !== undefined && input.ownerId !== build.ownerId) build.ownerId = await ownerFor(tx, input.ownerId, actor)
    if (input.name !== undefined) build.name = input.name
    if (input.description !== undefined) build.description = input.description
    if (input.targetDate !== undefined) build.targetDate = input.targetDate
    await tx.save(build)
    return toDetail(tx, build, actor)
  })
}

/** What finishing or shelving would release: every reservation the build still holds. */
export async function releasePreview(id: number, m = db().manager): Promise<ReleasePreviewDto> {
  const build = await buildOr404(m, id)
  const held = await m.find(Reservation, { where: { buildId: build.id }, order: { id: 'ASC' } })
  const parts = new Map((await m.findBy(Part, { id: In(held.map((r) => r.partId)) })).map((p) => [p.id, p]))
  return {
    buildId: build.id,
    lines: held.map((r) => {
      const p = parts.get(r.partId)!
      return { lineId: r.buildLineId, partId: p.id, partCode: p.code, partName: p.name, quantity: r.quantity, unit: p.unit }
    }),
  }
}

/**
 * Changes the status. Finishing or shelving releases what is still reserved and clears the
 * recorded shortages, but only once the user has seen the list (confirm: true); without it a
 * build that holds stock answers 409 CONFIRM_RELEASE with the list in the details.
 */
export async function changeStatus(id: number, raw: StatusInput, actor: Actor): Promise<BuildDetailDto> {
  const input = statusInput.parse(raw)
  return inTransaction(async (tx) => {
    const build = await editableBuild(tx, id, actor)
    if (CLOSING.has(input.status)) {
      const preview = await releasePreview(id, tx)
      if (preview.lines.length && !input.confirm) {
        throw conflict('CONFIRM_RELEASE',
          `${build.name} still holds ${preview.lines.length} reservation(s); confirm to release them and mark it ${input.status}.`,
          preview)
      }
      await tx.delete(Reservation, { buildId: build.id })
      await tx.update(BuildLine, { buildId: build.id }, { shortQuantity: 0 })
      const lines = await tx.findBy(BuildLine, { buildId: build.id })
      for (const line of lines) touchPart(tx, line.partId)
    }
    build.status = input.status
    await tx.save(build)
    return toDetail(tx, build, actor)
  })
}
