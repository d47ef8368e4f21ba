import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { clientFor, createTestApp, type Client } from '../helpers/app'
import { setSetting } from '../../server/services/settings'
import { DRILL_SET_SETTING } from '../../server/routes/calc'
import { Setting } from '../../server/entities'

let t: Awaited<ReturnType<typeof createTestApp>>
let anon: Client
beforeAll(async () => {
  t = await createTestApp()
  anon = await clientFor(t.app)
})
afterAll(() => t.close())

const get = (url: string) => request(t.app).get(url)

describe('GET /api/calc/thread', () => {
  it('answers 7BA without sign-in, with the BS 93 values and drills (BS 93:2008 table [S][F])', async () => {
    const res = await get('/api/calc/thread?designation=7ba').expect(200)
    expect(res.body).toMatchObject({
      series: 'BA', designation: '7BA', majorDiameterMm: 2.5, pitchMm: 0.48, angleDeg: 47.5,
      pitchDiameterMm: 2.212, minorDiameterMm: 1.924,
      tapDrill: { theoreticalMm: expect.any(Number), nearest: { name: '#46', diameterMm: 2.0574 } },
      clearanceDrill: { theoreticalMm: expect.any(Number), nearest: { name: expect.any(String), diameterMm: expect.any(Number) } },
    })
  })

  it('gives 1/4-20 UNC its tpi and the Machinery\'s Handbook 31st ed. tap drill #7 [S]', async () => {
    const res = await get(`/api/calc/thread?designation=${encodeURIComponent('1/4" UNC')}`).expect(200)
    expect(res.body).toMatchObject({ series: 'UNC', tpi: 20, angleDeg: 60, tapDrill: { nearest: { name: '#7' } } })
  })

  it('uses ISO 273 for a close-fit M3 clearance: 3.2 mm (from memory [M])', async () => {
    const res = await get('/api/calc/thread?designation=M3&fit=close').expect(200)
    expect(res.body.clearanceDrill).toMatchObject({ fit: 'close', theoreticalMm: 3.2, nearest: { name: '3.2 mm' } })
  })

  it('refuses an unknown designation with 400, suggesting the nearest valid ones in the message and details', async () => {
    const res = await get('/api/calc/thread?designation=17BA').expect(400)
    expect(res.body.error.code).toBe('UNKNOWN_THREAD')
    expect(res.body.error.message).toMatch(/Did you mean 16BA/)
    expect(res.body.error.details.suggestions).toContain('16BA')
  })

  it('refuses a missing designation with a message for the field', async () => {
    const res = await get('/api/calc/thread').expect(400)
    expect(res.body.error).toMatchObject({ code: 'INVALID_INPUT', details: [{ path: 'designation', message: 'designation is required' }] })
  })

  it('chooses drills from the workshop drill set when one is configured', async () => {
    await setSetting(DRILL_SET_SETTING, ['2.0 mm', '2.1 mm', '2.2 mm', '2.6 mm', '2.8 mm', '3.0 mm'])
    try {
      const res = await get('/api/calc/thread?designation=7BA').expect(200)
      expect(res.body.tapDrill.nearest.name).toBe('2.1 mm')
      expect(res.body.clearanceDrill.nearest.name).toBe('2.8 mm')
      const set = await get('/api/calc/drill-set').expect(200)
      expect(set.body).toMatchObject({ isDefault: false, rejected: [] })
      expect(set.body.drills).toHaveLength(6)
    } finally {
      await t.dataSource.getRepository(Setting).delete({ key: DRILL_SET_SETTING })
    }
  })
})

describe('GET /api/calc/drill', () => {
  it.each([['%2343', '#43', 2.2606, 0.089], ['43', '#43', 2.2606, 0.089], ['F', 'F', 6.5278, 0.257], ['3.3mm', '3.3 mm', 3.3, 0.1299], ['1/8', '1/8"', 3.175, 0.125]])(
    'reads %s as %s (ASME B94.11M via the toolmex chart [S])', async (typed, name, mm, inches) => {
      const res = await get(`/api/calc/drill?name=${typed}`).expect(200)
      expect(res.body).toMatchObject({ name, diameterMm: mm, diameterIn: inches, owned: true })
    })

  it('refuses a drill that does not exist with 400 UNKNOWN_DRILL', async () => {
    const res = await get('/api/calc/drill?name=%2381').expect(400)
    expect(res.body.error.code).toBe('UNKNOWN_DRILL')
  })

  it('lists the default drill set: 264 drills', async () => {
    const res = await get('/api/calc/drill-set').expect(200)
    expect(res.body.isDefault).toBe(true)
    expect(res.body.drills).toHaveLength(264)
  })
})

describe('GET /api/calc/bar and /materials', () => {
  it('weighs 1 m of Ø25 mild steel at 3.853 kg (worked example [F]; d²/162 [S])', async () => {
    const res = await get('/api/calc/bar?material=mild-steel&section=round&size=25&lengthMm=1000&pricePerKg=1.8').expect(200)
    expect(res.body).toMatchObject({ areaMm2: 490.87, massPerMetreKg: 3.8534, massKg: 3.8534, costPerMetre: 6.94, densityKgM3: 7850 })
    expect(res.body.material).toMatchObject({ id: 'mild-steel' })
  })

  it('weighs 1/2 in A/F brass hex at 1.183 kg/m, and takes a density instead of a material', async () => {
    const res = await get('/api/calc/bar?material=brass&section=hex&size=12.7').expect(200)
    expect(res.body.massPerMetreKg).toBeCloseTo(1.183, 3)
    const byDensity = await get('/api/calc/bar?density=8470&section=hex&size=12.7').expect(200)
    expect(byDensity.body.massPerMetreKg).toBe(res.body.massPerMetreKg)
  })

  it('weighs copper tube from outside and wall: 15 × 1 mm at 0.393 kg/m (worked example [F])', async () => {
    const res = await get('/api/calc/bar?material=copper&section=tube&outside=15&wall=1').expect(200)
    expect(res.body.massPerMetreKg).toBeCloseTo(0.393, 3)
  })

  it('lists every material with its density and source', async () => {
    const res = await get('/api/calc/materials').expect(200)
    expect(res.body.length).toBeGreaterThanOrEqual(13)
    for (const m of res.body) expect(m).toMatchObject({ id: expect.any(String), densityKgM3: expect.any(Number), source: expect.any(String) })
  })

  it.each([
    ['section=round&material=brass&size=-5', 'size', 'Size must be more than 0 mm'],
    ['section=round&material=brass&size=0', 'size', 'Size must be more than 0 mm'],
    ['section=round&material=brass&size=abc', 'size', 'Size must be a number'],
    ['section=round&material=brass&size=1e9', 'size', 'Size must be at most 1000 mm'],
    ['section=round&material=brass', 'size', 'Size is required for round bar'],
    ['section=flat&material=brass&width=20', 'thickness', 'Thickness is required for flat bar'],
    ['section=round&size=10', 'material', 'Give a material or a density'],
    ['section=round&size=10&material=unobtainium', 'material', 'Unknown material'],
    ['section=oval&size=10&material=brass', 'section', 'section must be one of'],
    ['section=tube&outside=10&wall=6&material=copper', 'wall', 'less than half'],
    ['section=round&size=10&density=99999', 'density', 'Density must be at most'],
  ])('refuses %s with 400 and a message for %s', async (qs, field, message) => {
    const res = await get(`/api/calc/bar?${qs}`).expect(400)
    expect(res.body.error.code).toBe('INVALID_INPUT')
    const issue = res.body.error.details.find((d: { path: string }) => d.path === field)
    expect(issue.message).toContain(message)
  })
})

describe('POST /api/calc/cutting-list', () => {
  it('cuts six 450 mm pieces from 3000 mm with a 1.5 mm kerf, 291 mm left, one piece not fitting ([F][CP])', async () => {
    const res = await anon.post('/api/calc/cutting-list', {
      stock: [{ id: 'bar-1', lengthMm: 3000 }], cuts: [{ label: 'axle', lengthMm: 450, qty: 7 }], kerfMm: 1.5, facingMm: 0,
    }).expect(200)
    expect(res.body.plans[0]).toMatchObject({ stockId: 'bar-1', sawCuts: 6, offcutMm: 291, kerfLossMm: 9 })
    expect(res.body.plans[0].cuts[1]).toMatchObject({ label: 'axle', startMm: 451.5, endMm: 901.5 })
    expect(res.body.unplaced).toEqual([{ label: 'axle', lengthMm: 450, qty: 1 }])
    expect(res.body.method).toBe('exact')
  })

  it('refuses negative kerf, zero lengths and fractional quantities with a message per field', async () => {
    const res = await anon.post('/api/calc/cutting-list', {
      stock: [{ id: 'a', lengthMm: 0 }], cuts: [{ label: 'x', lengthMm: 10, qty: 1.5 }], kerfMm: -1,
    }).expect(400)
    const paths = res.body.error.details.map((d: { path: string }) => d.path)
    expect(paths).toEqual(expect.arrayContaining(['stock.0.lengthMm', 'cuts.0.qty', 'kerfMm']))
  })
})

describe('GET /api/calc/count-by-weight, /reorder-point, /eoq', () => {
  it('counts 1500 pieces from a 50-piece, 42.5 g sample and 1275 g net ([CP][F])', async () => {
    const res = await get('/api/calc/count-by-weight?sampleCount=50&sampleWeightG=42.5&totalWeightG=1275&scaleResolutionG=0.1').expect(200)
    expect(res.body).toMatchObject({ count: 1500, low: 1496, high: 1504 })
  })

  it('gives ROP 96 (Heizer & Render example [M]) and 75 for the shop example [F]', async () => {
    expect((await get('/api/calc/reorder-point?dailyDemand=32&leadTimeDays=3').expect(200)).body).toMatchObject({ reorderPoint: 96 })
    expect((await get('/api/calc/reorder-point?dailyDemand=5&leadTimeDays=10&safetyStock=25').expect(200)).body).toMatchObject({ reorderPoint: 75 })
  })

  it('gives EOQ 200 for D 1000, S 10, H 0.50 (Heizer & Render "Sharp, Inc." [S]) and rounds up to packs', async () => {
    const res = await get('/api/calc/eoq?annualDemand=1000&orderCost=10&holdingCostPerUnitYear=0.5&packSize=24').expect(200)
    expect(res.body).toMatchObject({ eoq: 200, packs: 9, orderQuantity: 216 })
  })

  it.each([
    ['/api/calc/count-by-weight?sampleCount=0&sampleWeightG=42.5&totalWeightG=1275&scaleResolutionG=0.1', 'sampleCount', 'Sample count must be more than 0'],
    ['/api/calc/count-by-weight?sampleCount=50&sampleWeightG=NaN&totalWeightG=1275&scaleResolutionG=0.1', 'sampleWeightG', 'Sample weight must be a number'],
    ['/api/calc/count-by-weight?sampleCount=50&sampleWeightG=42.5&totalWeightG=1275&tareG=-1&scaleResolutionG=0.1', 'tareG', 'Tare cannot be negative'],
    ['/api/calc/reorder-point?dailyDemand=-3&leadTimeDays=3', 'dailyDemand', 'Daily demand must be more than 0'],
    ['/api/calc/reorder-point?dailyDemand=3&leadTimeDays=1e12', 'leadTimeDays', 'Lead time must be at most 3650 days'],
    ['/api/calc/eoq?annualDemand=1000&orderCost=10&holdingCostPerUnitYear=0', 'holdingCostPerUnitYear', 'must be more than 0'],
    ['/api/calc/eoq?annualDemand=1000&orderCost=10&holdingCostPerUnitYear=1&packSize=2.5', 'packSize', 'Pack size must be a whole number'],
    ['/api/calc/eoq?orderCost=10&holdingCostPerUnitYear=1', 'annualDemand', 'Annual demand is required'],
  ])('refuses %s with a message for %s', async (url, field, message) => {
    const res = await get(url).expect(400)
    const issue = res.body.error.details.find((d: { path: string }) => d.path === field)
    expect(issue.message).toContain(message)
  })
})
