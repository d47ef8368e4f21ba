import { copyFileSync, existsSync, mkdirSync, readdirSync, renameSync, rmSync } from 'node:fs'
import { join } from 'node:path'
import Database from 'better-sqlite3'
import { db } from '../db'
import { conflict } from '../errors'

/** Backups here are SQLite's; a PostgreSQL server is backed up with PostgreSQL's own tools. */
export const backupsHere = () => db().options.type === 'better-sqlite3'

/** better-sqlite3's own handle under TypeORM's driver (its online backup API lives there). */
function sqliteHandle(): Database.Database {
  const driver = db().driver as unknown as { databaseConnection?: Database.Database }
  if (!backupsHere() || !driver.databaseConnection) {
    throw conflict('BACKUP_ELSEWHERE',
      'This server keeps its data in PostgreSQL: back it up with pg_dump on the database server (see the README). Nothing was changed.')
  }
  return driver.databaseConnection
}

const stamp = (d = new Date()) => d.toISOString().replace(/[:.]/g, '-').slice(0, 23)

/**
 * A consistent copy of the live database, taken with SQLite's online backup while the app keeps
 * serving (pages changed during the copy are copied again, so the result is one point in time).
 */
export async function backupTo(dir: string): Promise<string> {
  mkdirSync(dir, { recursive: true })
  const path = join(dir, `binwright-${stamp()}.sqlite`)
  await sqliteHandle().backup(path)
  return path
}

/** Keeps the newest `keep` scheduled backups in `dir` and deletes older ones. */
export function pruneBackups(dir: string, keep: number): string[] {
  if (!existsSync(dir)) return []
  const files = readdirSync(dir).filter((f) => /^binwright-.*\.sqlite$/.test(f)).sort()
  const old = files.slice(0, Math.max(0, files.length - keep))
  for (const f of old) rmSync(join(dir, f))
  return old
}

export function listBackups(dir: string): string[] {
  if (!existsSync(dir)) return []
  return readdirSync(dir).filter((f) => /^binwright-.*\.sqlite$/.test(f)).sort().reverse()
}

/** Checks that `file` is a sound Binwright database: integrity check and our migrations table. */
export function verifyBackup(file: string): { migrations: number } {
  const probe = new Database(file, { readonly: true, fileMustExist: true })
  try {
    const integrity = probe.pragma('integrity_check', { simple: true })
    if (integrity !== 'ok') throw new Error(`integrity check failed: ${String(integrity)}`)
    const row = probe.prepare("SELECT COUNT(*) AS n FROM sqlite_master WHERE type = 'table' AND name = 'migrations'").get() as { n: number }
    if (!row.n) throw new Error('this file is not a Binwright database (no migrations table)')
    const { n } = probe.prepare('SELECT COUNT(*) AS n FROM migrations').get() as { n: number }
    return { migrations: n }
  } finally {
    probe.close()
  }
}

/**
 * Replaces the database at `target` with `file` (the server must be stopped). The current file
 * is kept beside it as `<target>.before-restore-<time>` so a wrong restore can be undone.
 */
export function restoreBackup(file: string, target: string): { keptAs: string | null } {
  verifyBackup(file)
  let keptAs: string | null = null
  if (existsSync(target)) {
    keptAs = `${target}.before-restore-${stamp()}`
    renameSync(target, keptAs)
  }
  for (const suffix of ['-wal', '-shm']) rmSync(target + suffix, { force: true })
  copyFileSync(file, target)
  return { keptAs }
}

/** Daily scheduled backups; the timer does not keep the process alive. */
export function scheduleDailyBackups(dir: string, keep: number, log: (msg: string) => void) {
  if (!backupsHere()) {
    log('Data in PostgreSQL: no scheduled backups from Binwright; schedule pg_dump on the database server.')
    return () => {}
  }
  const DAY_MS = 24 * 60 * 60 * 1000
  const timer = setInterval(() => {
    backupTo(dir)
      .then((path) => {
        pruneBackups(dir, keep)
        log(`Scheduled backup written: ${path}`)
      })
      .catch((err) => log(`Scheduled backup FAILED: ${String(err)}`))
  }, DAY_MS)
  timer.unref()
  return () => clearInterval(timer)
}
