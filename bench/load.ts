import { fork } from 'node:child_process'
import type { Options, Result } from 'autocannon'

export interface LoadOptions extends Options {
  /** GET these paths one after another across all connections (instead of `requests`, which each connection repeats). */
  paths?: string[]
}

/**
 * autocannon in a child process. In the benchmark's own process it would share one event loop
 * with the server it measures: every request would pay for both sides on one core, which hides
 * how much the server itself costs (a bare route and a heavy one come out closer than they are).
 * On a 2-core machine the server and the load generator each get a core this way.
 */
export function cannon(options: LoadOptions): Promise<Result & { wrapped: boolean }> {
  const child = fork(new URL('./cannon-worker.mjs', import.meta.url), { stdio: 'inherit' })
  return new Promise((resolve, reject) => {
    child.once('message', (r) => resolve(r as Result & { wrapped: boolean }))
    child.once('error', reject)
    child.once('exit', (code) => { if (code) reject(new Error(`load generator exited ${code}`)) })
    child.send(options)
  })
}

export interface BurstAnswer { status: number; ms: number }

/** Fires all `posts` at once from a child process (as `cannon` does, so the server has its core to itself). */
export function burst(base: string, session: { cookie: string; token: string }, posts: { path: string; body: object }[]): Promise<{ answers: BurstAnswer[]; ms: number }> {
  const child = fork(new URL('./burst-worker.mjs', import.meta.url), { stdio: 'inherit' })
  return new Promise((resolve, reject) => {
    child.once('message', (r) => resolve(r as { answers: BurstAnswer[]; ms: number }))
    child.once('error', reject)
    child.once('exit', (code) => { if (code) reject(new Error(`burst client exited ${code}`)) })
    child.send({ base, ...session, posts })
  })
}

interface Sampler {
  time: (url: string, headers?: Record<string, string>) => Promise<number>
}
let current: Sampler | undefined

/**
 * Latency of single requests, timed by a child process: a client in this process would make
 * garbage that the server's own collector pauses for, counted in the server's figures.
 * Started on first use, shared by every suite; it ends when the benchmark process does.
 */
export function sampler(): Sampler {
  if (current) return current
  const child = fork(new URL('./sampler-worker.mjs', import.meta.url), { stdio: 'inherit' })
  child.unref()
  child.channel?.unref()
  const waiting = new Map<number, { resolve: (ms: number) => void; reject: (e: Error) => void }>()
  let next = 0
  child.on('message', (m: { id: number; ms?: number; status?: number; error?: string }) => {
    const w = waiting.get(m.id)!
    waiting.delete(m.id)
    if (m.error || (m.status ?? 500) >= 400) w.reject(new Error(`sample answered ${m.error ?? m.status}`))
    else w.resolve(m.ms!)
  })
  current = {
    time: (url, headers = {}) => new Promise((resolve, reject) => {
      const id = next++
      waiting.set(id, { resolve, reject })
      child.send({ id, url, headers })
    }),
  }
  return current
}
