import type { PartKind } from '../../../shared/types/domain'

/** Plain words for the kinds of part, as the charts and lists show them. */
export const KIND_WORDS: Record<PartKind, string> = {
  fastener: 'Fasteners', gasket: 'Gaskets and seals', stock: 'Bar, tube and sheet', compound: 'Compounds and oils', other: 'Other',
}

export const shortDate = (iso: string) => new Date(`${iso.slice(0, 10)}T12:00:00`).toLocaleDateString(undefined, { day: 'numeric', month: 'short', year: 'numeric' })
