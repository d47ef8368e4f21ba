import { z } from 'zod'
import { drillSetSetting } from './calc'

/**
 * Workshop settings an admin may change, each with its schema. The keys are the ones the
 * features read with getSetting(): the Workbench reads `drillSet`, builds read `buildCutting`.
 */
export const settingSchemas = {
  workshopName: z.string().trim().min(1, 'is required').max(120),
  drillSet: drillSetSetting,
  buildCutting: z.object({
    kerfMm: z.number().min(0, 'must be 0 mm or more').max(10, 'must be at most 10 mm'),
    facingMm: z.number().min(0, 'must be 0 mm or more').max(10, 'must be at most 10 mm'),
  }).strict(),
} as const

export type SettingKey = keyof typeof settingSchemas
export const SETTING_KEYS = Object.keys(settingSchemas) as SettingKey[]
export type WorkshopSettings = { [K in SettingKey]: z.infer<(typeof settingSchemas)[K]> | null }

export const settingKeyParam = z.object({ key: z.enum(SETTING_KEYS as [SettingKey, ...SettingKey[]]) })
