import { spawn, type ChildProcess } from 'node:child_process'
import { mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'

export interface RunningServer {
  url: string
  dir: string
  process: ChildProcess
  output: () => string
  stop: () => Promise<void>
}

/**
 * Starts the server as `npm start` does (tsx server/index.ts, built client, demo data) on a fresh
 * database and a free port; resolves once it prints its address.
 */
export async function startServer(env: Record<string, string> = {}): Promise<RunningServer> {
  const dir = mkdtempSync(join(tmpdir(), 'binwright-e2e-'))
  const child = spawn(process.execPath, ['--import', 'tsx/esm', 'server/index.ts'], {
    env: {
      ...process.env,
      TSX_TSCONFIG_PATH: 'tsconfig.server.json',
      PORT: '0',
      HOST: '127.0.0.1',
      DATABASE_PATH: join(dir, 'e2e.sqlite'),
      UPLOAD_DIR: join(dir, 'uploads'),
      LOG_LEVEL: 'warn',
      ...env,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  })
  let out = ''
  child.stdout!.on('data', (d) => { out += d })
  child.stderr!.on('data', (d) => { out += d })
  const url = await new Promise<string>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`server did not start:\n${out}`)), 60_000)
    child.stdout!.on('data', () => {
      const m = /running at (http:\/\/localhost:\d+)/.exec(out)
      if (m) { clearTimeout(timer); resolve(m[1].replace('localhost', '127.0.0.1')) }
    })
    child.on('exit', (code) => { clearTimeout(timer); reject(new Error(`server exited ${code}:\n${out}`)) })
  })
  return {
    url, dir, process: child, output: () => out,
    stop: async () => {
      if (child.exitCode === null) {
        const exited = new Promise((r) => child.once('exit', r))
        child.kill('SIGTERM')
        await exited
      }
      rmSync(dir, { recursive: true, force: true })
    },
  }
}
