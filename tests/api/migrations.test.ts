import { describe, expect, it } from 'vitest'
import { mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { openDatabase } from '../../server/database'
import { postgresMigrations, sqliteMigrations } from '../../server/migrations'
import { tableNames } from '../helpers/db-digest'
import { freshDatabase, onPostgres } from '../helpers/test-database'

describe('migrations', () => {
  it('run on an empty database and do nothing on the next start', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'binwright-mig-'))
    const database = await freshDatabase(dir, 'm.sqlite')
    const first = await openDatabase(database.location)
    const applied = await first.query('SELECT name FROM migrations ORDER BY id')
    expect(applied).toHaveLength((onPostgres ? postgresMigrations : sqliteMigrations).length)
    expect(await tableNames(first)).toEqual(expect.arrayContaining(['parts', 'bins', 'movements', 'stock_lots', 'reservations', 'users', 'sessions']))
    await first.destroy()

    const second = await openDatabase(database.location)
    expect(await second.showMigrations()).toBe(false)
    expect(await second.query('SELECT name FROM migrations ORDER BY id')).toEqual(applied)
    await second.destroy()
    await database.drop()
    rmSync(dir, { recursive: true, force: true })
  })

  // Two migration sets from one set of entities: a column added to one and forgotten in the
  // other would only show on the other database. Compared on the PostgreSQL run.
  it.runIf(onPostgres)('build the same tables and columns on PostgreSQL as on SQLite', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'binwright-mig-'))
    const sqlite = await openDatabase(join(dir, 'same.sqlite'))
    const database = await freshDatabase(dir)
    const postgres = await openDatabase(database.location)
    const columnsOf = async (ds: typeof sqlite) => {
      const out: string[] = []
      for (const table of await tableNames(ds)) {
        if (table === 'migrations') continue
        const cols = ds.options.type === 'postgres'
          ? await ds.query('SELECT column_name AS name FROM information_schema.columns WHERE table_name = $1', [table])
          : await ds.query(`SELECT name FROM pragma_table_info('${table}')`)
        out.push(...(cols as { name: string }[]).map((c) => `${table}.${c.name}`))
      }
      return out.sort()
    }
    const expected = await columnsOf(sqlite)
    expect(expected.length).toBeGreaterThan(100)
    expect(await columnsOf(postgres)).toEqual(expected)
    await sqlite.destroy()
    await postgres.destroy()
    await database.drop()
    rmSync(dir, { recursive: true, force: true })
  })
})
