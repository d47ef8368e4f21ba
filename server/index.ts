/** Starts Binwright: database and migrations, first admin or demo data, then the web server. */
import { loadConfig } from './config'
import { openDatabase } from './database'
import { describeDatabase } from './data-source'
import { createApp } from './app'
import { ensureFirstAdmin } from './services/users'
import { scheduleDailyBackups } from './services/backup'
import { isEmpty, seedDemo } from '../seeds/demo'
import { DEMO_USERS } from '../seeds/demo-users'
import { startLocalMailSinkIfNeeded, startSchedules } from './services/notifications'

const config = loadConfig()
const mailSink = await startLocalMailSinkIfNeeded(config)
const ds = await openDatabase(config.database)

if (config.DEMO_DATA && (await isEmpty(ds))) {
  await seedDemo(ds)
  console.log('Loaded the demo scenario (an invented club workshop). Demo sign-ins:')
  for (const u of DEMO_USERS) console.log(`  ${u.role.padEnd(12)} ${u.username} / ${u.password}`)
}
const admin = await ensureFirstAdmin(config.ADMIN_USERNAME, config.ADMIN_PASSWORD)
if (admin?.oneTimePassword) {
  console.log(`First admin created: ${admin.username} / ${admin.oneTimePassword} (shown once: change it after signing in).`)
}

scheduleDailyBackups(config.BACKUP_DIR, config.BACKUP_KEEP, (msg) => console.log(msg))

let stopSchedules = () => {}
const app = createApp(config)
const server = app.listen(config.PORT, config.HOST, () => {
  const address = server.address()
  const port = typeof address === 'object' && address ? address.port : config.PORT
  // Links in e-mail must carry the real port when PORT=0 picked a free one.
  if (!config.PUBLIC_URL) config.publicUrl = `http://localhost:${port}`
  console.log(`Binwright is running at http://localhost:${port} (database ${describeDatabase(config.database)})`)
  console.log(mailSink
    ? `No SMTP_HOST set: e-mail goes to a local test mail server at ${mailSink.host}:${mailSink.port} and nowhere else; admins read it at /admin/outbox.`
    : `E-mail goes out through ${config.SMTP_HOST}:${config.SMTP_PORT}.`)
  stopSchedules = startSchedules(config)
})

const shutdown = () => {
  stopSchedules()
  void mailSink?.close()
  server.close(() => void ds.destroy().then(() => process.exit(0)))
}
process.on('SIGINT', shutdown)
process.on('SIGTERM', shutdown)
