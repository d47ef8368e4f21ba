import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { writeFileSync, existsSync, readdirSync } from 'node:fs'
import { join } from 'node:path'
import Database from 'better-sqlite3'
import { clientAs, createTestApp } from '../helpers/app'
import { onPostgres } from '../helpers/test-database'
import { pruneBackups, restoreBackup, backupTo } from '../../server/services/backup'

let t: Awaited<ReturnType<typeof createTestApp>>
beforeAll(async () => {
  t = await createTestApp({ demo: true })
  t.config.BACKUP_DIR = join(t.dir, 'backups')
})
afterAll(() => t.close())

/** Row counts and a content digest of the stores tables, to compare two databases. */
function digest(file: string) {
  const d = new Database(file, { readonly: true })
  const tables = ['parts', 'bins', 'stock_lots', 'movements', 'builds', 'build_lines', 'users']
  const out = Object.fromEntries(tables.map((name) => [name, JSON.stringify(d.prepare(`SELECT * FROM ${name} ORDER BY id`).all())]))
  d.close()
  return out
}

const binary = (res: import('superagent').Response, cb: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = []
  res.on('data', (c: Buffer) => chunks.push(c))
  res.on('end', () => cb(null, Buffer.concat(chunks)))
}

describe('GET /api/admin/backup', () => {
  it('refuses a storekeeper with 403', async () => {
    const c = await clientAs(t.app, 'storekeeper')
    expect((await c.get('/api/admin/backup')).status).toBe(403)
  })

  it.skipIf(onPostgres)('gives an admin a consistent copy that restores to the same data', async () => {
    const c = await clientAs(t.app, 'admin')
    const res = await c.get('/api/admin/backup').buffer(true).parse(binary)
    expect(res.status).toBe(200)
    expect(res.headers['content-disposition']).toMatch(/attachment; filename="binwright-.*\.sqlite"/)
    const body = res.body as Buffer
    expect(body.subarray(0, 15).toString()).toBe('SQLite format 3')
    const downloaded = join(t.dir, 'downloaded.sqlite')
    writeFileSync(downloaded, body)

    const restoredPath = join(t.dir, 'restored.sqlite')
    restoreBackup(downloaded, restoredPath)
    const live = digest(t.config.DATABASE_PATH)
    const restored = digest(restoredPath)
    expect(JSON.parse(restored.parts)).toHaveLength(JSON.parse(live.parts).length)
    expect(restored).toEqual(live)
  })

  it.skipIf(onPostgres)('keeps the previous database when restoring over it, and refuses a file that is not ours', async () => {
    const target = join(t.dir, 'target.sqlite')
    const backup = await backupTo(join(t.dir, 'manual'))
    writeFileSync(target, 'old')
    const { keptAs } = restoreBackup(backup, target)
    expect(keptAs && existsSync(keptAs)).toBe(true)
    const junk = join(t.dir, 'junk.sqlite')
    writeFileSync(junk, 'not a database at all')
    expect(() => restoreBackup(junk, target)).toThrow()
  })

  it.skipIf(onPostgres)('prunes scheduled backups to the newest N', async () => {
    const dir = join(t.dir, 'scheduled')
    for (let i = 0; i < 4; i++) {
      await backupTo(dir)
    }
    const removed = pruneBackups(dir, 2)
    expect(removed).toHaveLength(2)
    expect(readdirSync(dir)).toHaveLength(2)
  })
})

describe.runIf(onPostgres)('GET /api/admin/backup on PostgreSQL', () => {
  it('tells the admin to back up with pg_dump (409) and writes no file', async () => {
    const c = await clientAs(t.app, 'admin')
    const res = await c.get('/api/admin/backup')
    expect(res.status).toBe(409)
    expect(res.body.error.code).toBe('BACKUP_ELSEWHERE')
    expect(res.body.error.message).toContain('pg_dump')
    expect(existsSync(t.config.BACKUP_DIR) ? readdirSync(t.config.BACKUP_DIR) : []).toEqual([])
  })
})

describe('/api/admin/settings', () => {
  it('stores a valid drill set and the Workbench uses it for the nearest drill', async () => {
    const c = await clientAs(t.app, 'admin')
    const put = await c.put('/api/admin/settings/drillSet', { value: ['2.0', '2.5', '3.0', '#43'] })
    expect(put.status).toBe(200)
    const thread = await c.get('/api/calc/thread?designation=M3')
    // ISO 261/724: M3 × 0.5 tapping drill d − P = 2.5 mm (reference §2); 2.5 is in the set.
    expect(thread.body.tapDrill.nearest.diameterMm).toBe(2.5)
    expect((await c.get('/api/admin/settings')).body.drillSet).toEqual(['2.0', '2.5', '3.0', '#43'])
  })

  it('refuses an unknown key and a bad value with 400', async () => {
    const c = await clientAs(t.app, 'admin')
    expect((await c.put('/api/admin/settings/colour', { value: 'red' })).status).toBe(400)
    const bad = await c.put('/api/admin/settings/buildCutting', { value: { kerfMm: -1, facingMm: 0.5 } })
    expect(bad.status).toBe(400)
    expect(bad.body.error.message).toMatch(/kerfMm/)
  })
})
