import type { Express } from 'express'

/** One route the Express app answers: 'GET /api/parts/:id'. */
export interface RegisteredRoute {
  method: string
  path: string
  key: string
}

interface StackLayer {
  route?: { path: string | string[]; methods: Record<string, boolean> }
  handle?: { stack?: StackLayer[] }
  /** router 2.x keeps the path a layer was mounted with (app.use('/api/parts', router)). */
  rawPath?: string | string[]
}

const join = (prefix: string, path: string) => (prefix + (path === '/' ? '' : path)) || '/'

/**
 * Walks Express 5's router stack (app.router.stack, nested routers through layer.handle.stack and
 * each mount's layer.rawPath) and lists every method + path under /api.
 */
export function registeredRoutes(app: Express): RegisteredRoute[] {
  const found = new Map<string, RegisteredRoute>()
  const walk = (stack: StackLayer[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        const paths = [layer.route.path].flat()
        for (const p of paths) {
          for (const m of Object.keys(layer.route.methods)) {
            if (m === '_all') continue
            const method = m.toUpperCase()
            const path = join(prefix, p)
            found.set(`${method} ${path}`, { method, path, key: `${method} ${path}` })
          }
        }
      } else if (layer.handle?.stack) {
        const mount = [layer.rawPath ?? '/'].flat()
        if (mount.length !== 1 || typeof mount[0] !== 'string') throw new Error('a router mounted on several or pattern paths: list it by hand')
        walk(layer.handle.stack, join(prefix, mount[0]))
      }
    }
  }
  const router = (app as unknown as { router: { stack: StackLayer[] } }).router
  walk(router.stack, '')
  return [...found.values()].filter((r) => r.path.startsWith('/api')).sort((a, b) => a.key.localeCompare(b.key))
}
