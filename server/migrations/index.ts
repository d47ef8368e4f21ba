import { InitialSchema1796178977775 } from './1796178977775-InitialSchema'
import { PartSearchIndexes1796182912313 } from './1796182912313-PartSearchIndexes'

/** Listed explicitly, in order, so tsx, vitest and the CLI run the same migrations. */
export const migrations: Function[] = [InitialSchema1796178977775, PartSearchIndexes1796182912313]
