import type { Express } from 'express'
import type { Config } from '../config'
import { labelsRouter } from './labels'
import { scanRouter } from './scan'
import { stockTakeRouter } from './stocktake'
import { binsRouter, racksRouter, workshopsRouter } from './bins'
import { stockRouter } from './stock'
import { movementsRouter } from './movements'
import { reservationsRouter } from './reservations'
import { buildsRouter, shortagesRouter } from './builds'
import { suppliersRouter } from './suppliers'
import { reorderRouter } from './reorder'
import { attachmentsRouter } from './attachments'
import { partsRouter, stockLevelsRouter } from './parts'
import { ordersRouter } from './orders'
import { alertsRouter } from './alerts'
import { outboxRouter } from './outbox'
import { todayRouter } from './today'

/**
 * Mounts the routers of the stores features (parts, bins, stock, builds, labels, orders …).
 * Each feature adds one line here: app.use('/api/<resource>', <resource>Router).
 */
export function mountFeatureRouters(app: Express, config: Config) {
  app.use('/api/bins', binsRouter)
  app.use('/api/racks', racksRouter)
  app.use('/api/workshops', workshopsRouter)
  app.use('/api/stock', stockRouter)
  app.use('/api/movements', movementsRouter)
  app.use('/api/attachments', attachmentsRouter(config))
  app.use('/api/reservations', reservationsRouter)
  app.use('/api/builds', buildsRouter)
  app.use('/api/shortages', shortagesRouter)
  app.use('/api/suppliers', suppliersRouter)
  app.use('/api/parts', reorderRouter)
  app.use('/api/parts', partsRouter)
  app.use('/api/stock-levels', stockLevelsRouter)
  app.use('/api/orders', ordersRouter)
  app.use('/api/alerts', alertsRouter)
  app.use('/api/outbox', outboxRouter)
  app.use('/api/labels', labelsRouter(config))
  app.use('/api/scan', scanRouter)
  app.use('/api/stocktake', stockTakeRouter)
  app.use('/api/today', todayRouter)
}
