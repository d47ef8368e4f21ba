import type { Express } from 'express'
import type { Config } from '../config'

/**
 * Mounts the routers of the stores features (parts, bins, stock, builds, labels, orders …).
 * Each feature adds one line here: app.use('/api/<resource>', <resource>Router).
 */
export function mountFeatureRouters(app: Express, config: Config) {
  void app
  void config
}
