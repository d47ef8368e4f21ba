import { db } from '../db'
import { Setting } from '../entities'

/** A workshop setting, or the fallback when an admin has not set it. */
export async function getSetting<T>(key: string, fallback: T): Promise<T> {
  const row = await db().getRepository(Setting).findOneBy({ key })
  return row ? (row.value as T) : fallback
}

export async function setSetting<T>(key: string, value: T): Promise<T> {
  await db().getRepository(Setting).save({ key, value })
  return value
}
