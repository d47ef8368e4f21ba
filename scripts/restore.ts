/**
 * `npm run restore -- <backup file> [--yes]`: replaces the database with a backup.
 * Stop the server first. The current database is kept beside it so a wrong restore can be undone.
 */
import { createInterface } from 'node:readline/promises'
import { loadConfig } from '../server/config'
import { restoreBackup, verifyBackup } from '../server/services/backup'

const args = process.argv.slice(2)
const file = args.find((a) => !a.startsWith('--'))
if (!file) {
  console.error('Usage: npm run restore -- <backup file> [--yes]')
  process.exit(2)
}
const config = loadConfig()
try {
  const { migrations } = verifyBackup(file)
  console.log(`${file}: a sound Binwright database (${migrations} migrations applied).`)
} catch (err) {
  console.error(`Cannot restore ${file}: ${(err as Error).message}`)
  process.exit(1)
}
if (!args.includes('--yes')) {
  const rl = createInterface({ input: process.stdin, output: process.stdout })
  const answer = await rl.question(`This replaces ${config.DATABASE_PATH}. Stop the server first. Type RESTORE to go on: `)
  rl.close()
  if (answer.trim() !== 'RESTORE') {
    console.log('Nothing was changed.')
    process.exit(1)
  }
}
const { keptAs } = restoreBackup(file, config.DATABASE_PATH)
console.log(`Restored ${config.DATABASE_PATH} from ${file}.${keptAs ? ` The previous database is kept as ${keptAs}.` : ''}`)
