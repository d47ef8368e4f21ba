import { describe, expect, it } from 'vitest'
import { mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { openDatabase } from '../../server/database'
import { migrations } from '../../server/migrations'

describe('migrations', () => {
  it('run on an empty file and do nothing on the next start', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'binwright-mig-'))
    const path = join(dir, 'm.sqlite')
    const first = await openDatabase(path)
    const applied = await first.query('SELECT name FROM migrations ORDER BY id')
    expect(applied).toHaveLength(migrations.length)
    const tables = (await first.query("SELECT name FROM sqlite_master WHERE type = 'table'")).map((r: { name: string }) => r.name)
    expect(tables).toEqual(expect.arrayContaining(['parts', 'bins', 'movements', 'stock_lots', 'reservations', 'users', 'sessions']))
    await first.destroy()

    const second = await openDatabase(path)
    expect(await second.showMigrations()).toBe(false)
    expect(await second.query('SELECT name FROM migrations ORDER BY id')).toEqual(applied)
    await second.destroy()
    rmSync(dir, { recursive: true, force: true })
  })
})
