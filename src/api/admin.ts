import { request } from './http'
import type { SettingKey, WorkshopSettings } from '../../shared/schemas/settings'

export interface BackupList {
  dir: string
  keep: number
  files: string[]
}

export const adminApi = {
  settings: () => request<WorkshopSettings>('GET', '/admin/settings'),
  saveSetting: <K extends SettingKey>(key: K, value: WorkshopSettings[K]) =>
    request<{ key: K; value: WorkshopSettings[K] }>('PUT', `/admin/settings/${key}`, { value }),
  backups: () => request<BackupList>('GET', '/admin/backups'),
  /** Plain link: the browser downloads the file. */
  backupUrl: '/api/admin/backup',
}
