import { Router } from 'express'
import { currentUser, requireRole } from '../middleware/auth'
import {
  adjustStockLot, countStock, moveStockBetweenBins, receiveStockDto, returnStock, takeStock,
} from '../services/stock'

/**
 * Stock changes, one ledger transaction each. Builders may take and put back; receiving,
 * moving, adjusting and counting are the storekeeper's (DESIGN.md roles).
 */
export const stockRouter = Router()
const builder = requireRole('builder')
const keeper = requireRole('storekeeper')

stockRouter.post('/take', builder, async (req, res) => {
  res.json(await takeStock(req.body, currentUser(req)))
})

stockRouter.post('/return', builder, async (req, res) => {
  res.json(await returnStock(req.body, currentUser(req)))
})

stockRouter.post('/receive', keeper, async (req, res) => {
  res.status(201).json(await receiveStockDto(req.body, currentUser(req)))
})

stockRouter.post('/move', keeper, async (req, res) => {
  res.json(await moveStockBetweenBins(req.body, currentUser(req)))
})

stockRouter.post('/adjust', keeper, async (req, res) => {
  res.json(await adjustStockLot(req.body, currentUser(req)))
})

stockRouter.post('/count', keeper, async (req, res) => {
  res.json(await countStock(req.body, currentUser(req)))
})
