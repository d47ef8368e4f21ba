import type { EntityManager } from 'typeorm'
import { Build, BuildLine, Part } from '../entities'
import { conflict, forbidden, notFound } from '../errors'
import { getSetting } from './settings'
import { roleAtLeast, type Role } from '../../shared/types/api'
import { stockModeOf } from '../../shared/types/domain'
import {
  DEFAULT_BUILD_FACING_MM, DEFAULT_BUILD_KERF_MM, type CuttingAllowance,
} from '../../shared/domain/bom'

/** Who is acting: the signed-in user's id and role. */
export interface Actor {
  id: number
  role: Role
}

/** Settings key of the saw kerf and facing allowance bar lines are planned with. */
export const CUTTING_SETTING = 'buildCutting'

/** The workshop's kerf and facing allowance, or the common-practice defaults. */
export async function cuttingAllowance(): Promise<CuttingAllowance> {
  const stored = await getSetting<Partial<CuttingAllowance> | null>(CUTTING_SETTING, null)
  const ok = (n: unknown) => typeof n === 'number' && n >= 0 && n < 10
  return {
    kerfMm: ok(stored?.kerfMm) ? stored!.kerfMm! : DEFAULT_BUILD_KERF_MM,
    facingMm: ok(stored?.facingMm) ? stored!.facingMm! : DEFAULT_BUILD_FACING_MM,
  }
}

/** Builders change their own builds; storekeepers and admins any; viewers none. */
export const canEditBuild = (build: Build, actor: Actor) =>
  roleAtLeast(actor.role, 'storekeeper') || (actor.role === 'builder' && build.ownerId === actor.id)

export async function buildOr404(tx: EntityManager, id: number): Promise<Build> {
  const build = await tx.findOneBy(Build, { id })
  if (!build) throw notFound('The build')
  return build
}

/** The build, checked that `actor` may change it (403 otherwise). */
export async function editableBuild(tx: EntityManager, id: number, actor: Actor): Promise<Build> {
  const build = await buildOr404(tx, id)
  if (!canEditBuild(build, actor)) {
    throw forbidden('Only the build\'s owner, a storekeeper or an admin may change this build.')
  }
  return build
}

/** Finished and shelved builds hold nothing: no new reservations or draws until reopened. */
export function assertOpen(build: Build) {
  if (build.status === 'finished' || build.status === 'shelved') {
    throw conflict('BUILD_CLOSED', `${build.name} is ${build.status}; set it back to planned or active first.`)
  }
}

export async function lineOf(tx: EntityManager, build: Build, lineId: number): Promise<BuildLine> {
  const line = await tx.findOneBy(BuildLine, { id: lineId, buildId: build.id })
  if (!line) throw notFound('The build line')
  return line
}

export const isBar = (part: Pick<Part, 'kind'>) => stockModeOf(part.kind) === 'length'

/** A line in the shape the shared BOM arithmetic takes. */
export const shapeOf = (line: BuildLine, part: Pick<Part, 'kind'>) => ({
  quantity: line.quantity, pieces: line.pieces, drawn: line.drawn, bar: isBar(part),
})
