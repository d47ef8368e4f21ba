import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { clientAs, createTestApp, type Client } from '../helpers/app'
import { Part } from '../../server/entities'

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
})
