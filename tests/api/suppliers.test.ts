import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { clientAs, createTestApp, type Client } from '../helpers/app'
import { Movement, Part, StockLot } from '../../server/entities'

let t: Awaited<ReturnType<typeof createTestApp>>
let keeper: Client
let partId: number
beforeAll(async () => {
  t = await createTestApp({ demo: true })
  keeper = await clientAs(t.app, 'storekeeper')
  partId = (await t.dataSource.getRepository(Part).findOneByOrFail({ name: 'M3 full nut, stainless A2' })).id
})
afterAll(() => t.close())

describe('/api/suppliers', () => {
  it('creates a supplier, adds an offer, and refuses a second offer of the same part with 409', async () => {
    const created = await keeper.post('/api/suppliers', { name: 'Pennine Fixings (invented)', email: 'sales@pennine.example', leadTimeDays: 3 })
    expect(created.status).toBe(201)
    expect(created.body).toMatchObject({ name: 'Pennine Fixings (invented)', leadTimeDays: 3, website: '', offerCount: 0 })
    const offer = await keeper.post(`/api/suppliers/${created.body.id}/offers`, { partId, supplierCode: 'PF-M3N', packSize: 50, packPrice: 2.5 })
    expect(offer.status).toBe(201)
    expect(offer.body).toMatchObject({ partId, packSize: 50, packPrice: 2.5, unitPrice: 0.05, preferred: false })
    const again = await keeper.post(`/api/suppliers/${created.body.id}/offers`, { partId, packSize: 10, packPrice: 1 })
    expect(again.status).toBe(409)
    expect(again.body.error.code).toBe('OFFER_EXISTS')
  })

  it('refuses a bad e-mail with 400 INVALID_INPUT and a builder with 403', async () => {
    const bad = await keeper.post('/api/suppliers', { name: 'X', email: 'not-an-address' })
    expect(bad.status).toBe(400)
    expect(bad.body.error.code).toBe('INVALID_INPUT')
    const builder = await clientAs(t.app, 'builder')
    expect((await builder.get('/api/suppliers')).status).toBe(403)
  })

  it('shows a part\'s offers, preferred first, and sets the preferred supplier and rules by PATCH', async () => {
    const supply = await keeper.get(`/api/parts/${partId}/supply`)
    expect(supply.status).toBe(200)
    expect(supply.body.offers).toHaveLength(2)
    expect(supply.body.offers[0]).toMatchObject({ preferred: true, supplierName: 'Wyvern Model Supplies (invented)' })
    const other = supply.body.offers[1]
    const patched = await keeper.patch(`/api/parts/${partId}/reorder`, { preferredSupplierId: other.supplierId, reorderPoint: 60, reorderQuantity: 150 })
    expect(patched.status).toBe(200)
    expect(patched.body.part).toMatchObject({ reorderPoint: 60, reorderQuantity: 150, preferredSupplierId: other.supplierId, onHand: 140 })
    expect(patched.body.offers[0].supplierName).toBe('Pennine Fixings (invented)')
    const viewer = await clientAs(t.app, 'viewer')
    expect((await viewer.patch(`/api/parts/${partId}/reorder`, { reorderPoint: 1 })).status).toBe(403)
  })

  it('suggests a reorder point and quantity from the part\'s own draws, and changes nothing', async () => {
    const bin = (await t.dataSource.getRepository(StockLot).findOneByOrFail({ partId })).binId
    for (let i = 0; i < 3; i++) {
      expect((await keeper.post('/api/stock/take', { partId, binId: bin, quantity: 10, reason: 'steam chest' })).status).toBe(200)
    }
    // Spread the three draws over the last month: 2, 9 and 20 days ago.
    const moves = await t.dataSource.getRepository(Movement).find({ where: { partId, kind: 'draw' }, order: { id: 'ASC' } })
    for (const [i, ago] of [2, 9, 20].entries()) {
      await t.dataSource.getRepository(Movement).update({ id: moves[i].id }, { at: new Date(Date.now() - ago * 86_400_000) })
    }
    const res = await keeper.get(`/api/parts/${partId}/reorder-suggestion?windowDays=30&leadTimeDays=5&safetyStock=0&orderCost=5&holdingRate=0.25`)
    expect(res.status).toBe(200)
    // 30 used in 30 days → d = 1/day; ROP = 1 × 5 + 0 = 5 (formula, reference §8).
    // D = 365/yr, S = 5, H = 0.08 × 25 % = 0.02 → Q* = √(2 × 365 × 5 / 0.02) = 427.2 → 9 packs of 50 = 450.
    expect(res.body).toMatchObject({ used: 30, drawCount: 3, dailyUse: 1, reorderPoint: 5, annualDemand: 365, packSize: 50, packs: 9, orderQuantity: 450 })
    expect(res.body.eoq).toBeCloseTo(427.2, 1)
    expect(res.body.steps.map((x: { label: string }) => x.label)).toContain('Economic order quantity Q*')
    expect((await keeper.get(`/api/parts/${partId}/supply`)).body.part).toMatchObject({ reorderPoint: 60, reorderQuantity: 150 })
    expect((await keeper.get(`/api/parts/${partId}/reorder-suggestion?windowDays=3`)).status).toBe(400)
  })
})
