import { Worker } from 'node:worker_threads'
import { availableParallelism } from 'node:os'

/** One image to thumbnail: read `source`, write one file per output width. */
export interface ThumbnailJob {
  source: string
  mime: string
  outputs: { width: number; path: string }[]
}

export type ThumbnailResult =
  | { ok: true; width: number; height: number; made: { width: number; path: string; actualWidth: number }[] }
  | { ok: false; error: string }

interface Task {
  job: ThumbnailJob & { id: number }
  resolve: (r: ThumbnailResult) => void
  timer?: NodeJS.Timeout
}

/** A .mjs worker loads without the tsx/vitest loaders (worker threads start a bare Node). */
const WORKER_URL = new URL('../workers/thumbnail-worker.mjs', import.meta.url)
/** Workers: one per core beyond the first, at most two; on the 2-core target one worker leaves a
 *  core free for requests (decoding a 12 MP JPEG in pure JS keeps a core busy for seconds). */
const POOL_SIZE = Math.max(1, Math.min(2, availableParallelism() - 1))
/** A job running longer is abandoned and its worker replaced (a 50 MP image takes ~15 s here). */
const JOB_TIMEOUT_MS = 90_000

/**
 * A small pool of worker threads that make thumbnails off the request's path. Jobs queue in
 * order; a worker that crashes or hangs fails its job and is replaced; the server never waits.
 * Workers are unref'd so an idle pool never keeps a process (tests, scripts) alive.
 */
export class ThumbnailPool {
  private idle: Worker[] = []
  private workers = new Set<Worker>()
  private queue: Task[] = []
  private running = new Map<Worker, Task>()
  private nextId = 1

  constructor(private readonly size = POOL_SIZE) {}

  run(job: ThumbnailJob): Promise<ThumbnailResult> {
    return new Promise((resolve) => {
      this.queue.push({ job: { ...job, id: this.nextId++ }, resolve })
      this.pump()
    })
  }

  /** Jobs waiting or running. */
  get pending() {
    return this.queue.length + this.running.size
  }

  async close() {
    const all = [...this.workers]
    this.workers.clear()
    this.idle = []
    for (const task of this.queue.splice(0)) task.resolve({ ok: false, error: 'The thumbnail pool was closed.' })
    await Promise.all(all.map((w) => w.terminate()))
  }

  private pump() {
    while (this.queue.length) {
      const worker = this.idle.pop() ?? (this.workers.size < this.size ? this.spawn() : undefined)
      if (!worker) return
      const task = this.queue.shift()!
      task.timer = setTimeout(() => this.fail(worker, 'Making the thumbnails took too long.'), JOB_TIMEOUT_MS)
      task.timer.unref()
      this.running.set(worker, task)
      worker.postMessage(task.job)
    }
  }

  private spawn() {
    const worker = new Worker(WORKER_URL)
    worker.unref()
    worker.on('message', (msg: ThumbnailResult) => {
      const task = this.running.get(worker)
      if (!task) return
      clearTimeout(task.timer)
      this.running.delete(worker)
      this.idle.push(worker)
      task.resolve(msg)
      this.pump()
    })
    worker.on('error', (err) => this.fail(worker, `The thumbnail worker failed: ${err.message}`))
    worker.on('exit', () => this.fail(worker, 'The thumbnail worker stopped.'))
    this.workers.add(worker)
    return worker
  }

  /** Fails the worker's job (if any), drops the worker and lets a fresh one take the queue. */
  private fail(worker: Worker, error: string) {
    const task = this.running.get(worker)
    this.running.delete(worker)
    const known = this.workers.delete(worker)
    this.idle = this.idle.filter((w) => w !== worker)
    if (known) void worker.terminate()
    if (task) {
      clearTimeout(task.timer)
      task.resolve({ ok: false, error })
    }
    if (known) this.pump()
  }
}
