import type { DataSource } from 'typeorm'
import { createDataSource } from './data-source'
import { useDataSource } from './db'

/** Opens the database, brings its schema up to date and makes it the services' database. */
export async function openDatabase(path: string): Promise<DataSource> {
  const ds = await createDataSource(path).initialize()
  await ds.runMigrations({ transaction: 'each' })
  useDataSource(ds)
  return ds
}
