import { InitialSchema1796178977775 } from './sqlite/1796178977775-InitialSchema'
import { PartSearchIndexes1796182912313 } from './sqlite/1796182912313-PartSearchIndexes'
import { InitialSchema1796188614130 } from './postgres/1796188614130-InitialSchema'

/**
 * Listed explicitly, in order, so tsx, vitest and the CLI run the same migrations.
 * Each database has its own set (SQL differs); a schema change adds one migration to each.
 */
export const sqliteMigrations: Function[] = [InitialSchema1796178977775, PartSearchIndexes1796182912313]
export const postgresMigrations: Function[] = [InitialSchema1796188614130]
