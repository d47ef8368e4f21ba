import { Router } from 'express'
import type { Config } from '../config'
import { requireRole } from '../middleware/auth'
import { labelItems } from '../services/label-items'
import { labelPdf } from '../services/labels'
import { labelSelection } from '../../shared/schemas/labels'

/** /api/labels: label contents for the preview, and the printable PDF (storekeepers and up). */
export function labelsRouter(config: Config) {
  const router = Router()
  router.use(requireRole('storekeeper'))

  router.post('/items', async (req, res) => {
    res.json(await labelItems(labelSelection.parse(req.body), config.publicUrl))
  })

  router.post('/pdf', async (req, res) => {
    const { pdf, labels, pages } = await labelPdf(req.body, config.publicUrl)
    const day = new Date().toISOString().slice(0, 10)
    res.set({
      'Content-Type': 'application/pdf',
      'Content-Disposition': `attachment; filename="binwright-labels-${day}.pdf"`,
      'X-Label-Count': String(labels),
      'X-Page-Count': String(pages),
    }).send(pdf)
  })
  return router
}
