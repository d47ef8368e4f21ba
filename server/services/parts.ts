import type { EntityManager } from 'typeorm'
import { Part } from '../entities'
import { conflict } from '../errors'
import { newLabelCode } from './codes'
import { partInput, type PartAttributes, type PartInput } from '../../shared/schemas/part'
import { stockModeOf } from '../../shared/types/domain'

/** Search columns copied out of the kind-specific attributes (see the Part entity). */
export function derivePartColumns(a: PartAttributes) {
  switch (a.kind) {
    case 'fastener':
      return { form: a.type, threadKey: normaliseThread(a.thread), lengthMm: a.lengthMm ?? null, sizeMm: null, material: a.material.toLowerCase() }
    case 'gasket':
      return { form: null, threadKey: null, lengthMm: null, sizeMm: a.thicknessMm, material: a.material.toLowerCase() }
    case 'stock':
      return { form: a.section, threadKey: null, lengthMm: null, sizeMm: a.sizeMm, material: a.material.toLowerCase() }
    default:
      return { form: null, threadKey: null, lengthMm: null, sizeMm: null, material: null }
  }
}

/** Placeholder until the Workbench thread parser lands: upper case, no spaces. */
function normaliseThread(thread: string) {
  return thread.toUpperCase().replace(/\s+/g, '')
}

const DEFAULT_UNIT = { count: 'pcs', length: 'mm', batch: 'each' } as const

/** Creates a part inside the caller's transaction. */
export async function createPart(tx: EntityManager, raw: PartInput): Promise<Part> {
  const input = partInput.parse(raw)
  const code = input.code ?? suggestPartCode(input.attributes, input.name)
  if (await tx.existsBy(Part, { code })) {
    throw conflict('CODE_TAKEN', `The part code ${code} is already used by another part.`)
  }
  return tx.save(Part, tx.create(Part, {
    ...input,
    code,
    kind: input.attributes.kind,
    unit: input.unit ?? DEFAULT_UNIT[stockModeOf(input.attributes.kind)],
    ...derivePartColumns(input.attributes),
    labelCode: newLabelCode('P'),
  }))
}

/** Suggests a code from the attributes, e.g. "7BA-STUD-20-BR" or "HEX-6.35-BR". */
export function suggestPartCode(a: PartAttributes, name: string): string {
  const mat = (m: string) => m.replace(/[^a-z0-9]/gi, '').slice(0, 3).toUpperCase()
  const parts: (string | number | null | undefined)[] =
    a.kind === 'fastener' ? [normaliseThread(a.thread), a.type.toUpperCase(), a.lengthMm, mat(a.material)]
      : a.kind === 'stock' ? [a.section.toUpperCase(), a.sizeMm, mat(a.material)]
        : a.kind === 'gasket' ? ['GSK', a.thicknessMm, mat(a.material)]
          : [a.kind.slice(0, 3).toUpperCase(), name.replace(/[^a-z0-9]/gi, '').slice(0, 10).toUpperCase()]
  return parts.filter((p) => p !== null && p !== undefined && p !== '').join('-').slice(0, 48)
}
