import { Router } from 'express'
import { createReadStream } from 'node:fs'
import { basename } from 'node:path'
import { requireRole } from '../middleware/auth'
import { getSetting, setSetting } from '../services/settings'
import { backupTo, listBackups } from '../services/backup'
import { settingKeyParam, settingSchemas, SETTING_KEYS, type WorkshopSettings } from '../../shared/schemas/settings'
import type { Config } from '../config'

/** Workshop settings and backups: admins only. */
export function adminRouter(config: Config) {
  const admin = Router()
  admin.use(requireRole('admin'))

  admin.get('/settings', async (_req, res) => {
    const entries = await Promise.all(SETTING_KEYS.map(async (k) => [k, await getSetting(k, null)] as const))
    res.json(Object.fromEntries(entries) as WorkshopSettings)
  })

  admin.put('/settings/:key', async (req, res) => {
    const { key } = settingKeyParam.parse(req.params)
    res.json({ key, value: await setSetting(key, settingSchemas[key].parse(req.body?.value)) })
  })

  /** A consistent copy of the live database, downloaded while the app stays in use. */
  admin.get('/backup', async (req, res) => {
    const path = await backupTo(config.BACKUP_DIR)
    req.log?.info({ path }, 'backup downloaded')
    res.set('Content-Type', 'application/vnd.sqlite3')
    res.set('Content-Disposition', `attachment; filename="${basename(path)}"`)
    createReadStream(path).pipe(res)
  })

  admin.get('/backups', (_req, res) => {
    res.json({ dir: config.BACKUP_DIR, keep: config.BACKUP_KEEP, files: listBackups(config.BACKUP_DIR) })
  })

  return admin
}
