import type { Express } from 'express'
import type { Config } from '../config'
import { reservationsRouter } from './reservations'

/**
 * Mounts the routers of the stores features (parts, bins, stock, builds, labels, orders …).
 * Each feature adds one line here: app.use('/api/<resource>', <resource>Router).
 */
export function mountFeatureRouters(app: Express, config: Config) {
  app.use('/api/reservations', reservationsRouter)
  void app
  void config
}
