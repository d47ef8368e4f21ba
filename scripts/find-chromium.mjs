#!/usr/bin/env node
// Finds a Chromium for the browser tests. When none is found and we run as root on Debian,
// installs Debian's own `chromium` package; nothing is ever downloaded from elsewhere.
import { existsSync, readFileSync } from 'node:fs'
import { execSync } from 'node:child_process'

const candidates = [process.env.CHROMIUM_PATH, '/usr/bin/chromium', '/usr/bin/chromium-browser', '/usr/bin/google-chrome', '/snap/bin/chromium']
const found = () => candidates.find((p) => p && existsSync(p))

let path = found()
const isDebian = existsSync('/etc/debian_version') || /debian/i.test(existsSync('/etc/os-release') ? readFileSync('/etc/os-release', 'utf8') : '')
if (!path && process.getuid?.() === 0 && isDebian) {
  console.log('No Chromium found: installing Debian\'s chromium package (apt-get, about 80 s) …')
  execSync('apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium', { stdio: 'inherit' })
  path = found()
}
if (!path) {
  console.error([
    'The browser tests need Chromium and none was found.',
    'Install it with:  sudo apt-get install chromium   (Debian/Ubuntu)',
    'or point CHROMIUM_PATH at a Chromium or Chrome binary, then run the tests again.',
  ].join('\n'))
  process.exit(1)
}
console.log(`Chromium for browser tests: ${path}`)
