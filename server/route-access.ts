import type { Role } from '../shared/types/api'

/**
 * Who may call each API route: the least role allowed (every role above it may too, viewer <
 * builder < storekeeper < admin), 'viewer' meaning any signed-in member and 'public' no sign-in.
 * Follows DESIGN.md "Users and roles". tests/api/route-matrix.test.ts walks the routes the app
 * really registers: a route missing here, or an entry with no route, fails it; then it calls
 * every route as every role and as nobody and checks 401 / 403 / allowed against this table.
 */
export type AccessLevel = 'public' | Role

export interface RouteAccess {
  least: AccessLevel
  /** Rules beyond the role, checked inside the service. */
  note?: string
}

const OWN_BUILD = 'builders change only builds they own; storekeeper and admin any build (builds-access.ts)'

export const ROUTE_ACCESS: Record<string, RouteAccess> = {
  'GET /api/health': { least: 'public' },
  'GET /api/auth/session': { least: 'public', note: 'hands out the CSRF token' },
  'POST /api/auth/login': { least: 'public', note: 'throttled per address + username' },
  'POST /api/auth/logout': { least: 'public', note: 'ends whatever session there is' },
  'POST /api/auth/password': { least: 'viewer', note: 'one\'s own password only' },

  'GET /api/users': { least: 'admin' },
  'POST /api/users': { least: 'admin' },
  'PATCH /api/users/:id': { least: 'admin' },
  'GET /api/admin/settings': { least: 'admin' },
  'PUT /api/admin/settings/:key': { least: 'admin' },
  'GET /api/admin/backup': { least: 'admin' },
  'GET /api/admin/backups': { least: 'admin' },
  'GET /api/outbox': { least: 'admin' },
  'GET /api/outbox/status': { least: 'admin' },
  'GET /api/outbox/:id': { least: 'admin' },
  'GET /api/outbox/:id/attachments/:index': { least: 'admin' },
  'POST /api/outbox/:id/retry': { least: 'admin' },

  'GET /api/calc/thread': { least: 'public', note: 'calculators are read-only and public' },
  'GET /api/calc/drill': { least: 'public' },
  'GET /api/calc/drill-set': { least: 'public' },
  'GET /api/calc/materials': { least: 'public' },
  'GET /api/calc/bar': { least: 'public' },
  'POST /api/calc/cutting-list': { least: 'public', note: 'a POST only for its body; changes nothing' },
  'GET /api/calc/count-by-weight': { least: 'public' },
  'GET /api/calc/reorder-point': { least: 'public' },
  'GET /api/calc/eoq': { least: 'public' },

  'GET /api/parts': { least: 'viewer' },
  'GET /api/parts/export.csv': { least: 'viewer' },
  'GET /api/parts/by-label/:labelCode': { least: 'viewer' },
  'GET /api/parts/:id': { least: 'viewer' },
  'GET /api/parts/:id/supply': { least: 'viewer' },
  'GET /api/parts/:id/reorder-suggestion': { least: 'viewer' },
  'POST /api/parts': { least: 'storekeeper' },
  'POST /api/parts/import': { least: 'storekeeper' },
  'POST /api/parts/suggest-code': { least: 'storekeeper' },
  'PATCH /api/parts/:id': { least: 'storekeeper' },
  'PATCH /api/parts/:id/reorder': { least: 'storekeeper' },
  'POST /api/parts/:id/archive': { least: 'storekeeper' },
  'POST /api/parts/:id/restore': { least: 'storekeeper' },
  'DELETE /api/parts/:id': { least: 'storekeeper', note: 'only a part never used (409 otherwise)' },
  'GET /api/stock-levels/export.csv': { least: 'viewer' },
  'POST /api/stock-levels/import': { least: 'storekeeper' },

  'GET /api/attachments': { least: 'viewer' },
  'GET /api/attachments/rules': { least: 'viewer' },
  'GET /api/attachments/:id': { least: 'viewer' },
  'GET /api/attachments/:id/file': { least: 'viewer' },
  'GET /api/attachments/:id/thumb/:width': { least: 'viewer' },
  'POST /api/attachments': { least: 'builder', note: 'on parts storekeeper+; on builds ' + OWN_BUILD },
  'DELETE /api/attachments/:id': { least: 'builder', note: 'as for upload' },

  'GET /api/bins': { least: 'viewer' },
  'GET /api/bins/:code': { least: 'viewer' },
  'POST /api/bins': { least: 'storekeeper' },
  'PATCH /api/bins/:id': { least: 'storekeeper' },
  'POST /api/bins/:id/retire': { least: 'storekeeper' },
  'POST /api/bins/:id/unretire': { least: 'storekeeper' },
  'POST /api/racks': { least: 'storekeeper' },
  'PATCH /api/racks/:id': { least: 'storekeeper' },
  'POST /api/workshops': { least: 'storekeeper' },
  'PATCH /api/workshops/:id': { least: 'storekeeper' },

  'POST /api/stock/take': { least: 'builder', note: 'builders take from a bin; not what others reserved' },
  'POST /api/stock/return': { least: 'builder' },
  'POST /api/stock/receive': { least: 'storekeeper' },
  'POST /api/stock/move': { least: 'storekeeper' },
  'POST /api/stock/adjust': { least: 'storekeeper' },
  'POST /api/stock/count': { least: 'storekeeper' },
  'POST /api/stocktake/apply': { least: 'storekeeper' },
  'GET /api/movements': { least: 'viewer' },
  'GET /api/movements/export.csv': { least: 'viewer' },
  'GET /api/movements/people': { least: 'viewer' },
  'POST /api/movements/:id/reverse': { least: 'storekeeper' },

  'GET /api/builds': { least: 'viewer' },
  'GET /api/builds/:id': { least: 'viewer' },
  'GET /api/builds/:id/release-preview': { least: 'viewer' },
  'GET /api/builds/:id/shortages': { least: 'viewer' },
  'GET /api/builds/:id/lines/:lineId/cutting-plan': { least: 'viewer' },
  'POST /api/builds': { least: 'builder', note: 'a builder\'s new build is their own' },
  'PATCH /api/builds/:id': { least: 'builder', note: OWN_BUILD },
  'POST /api/builds/:id/status': { least: 'builder', note: OWN_BUILD },
  'POST /api/builds/:id/lines': { least: 'builder', note: OWN_BUILD },
  'POST /api/builds/:id/lines/import': { least: 'builder', note: OWN_BUILD },
  'POST /api/builds/:id/lines/copy': { least: 'builder', note: OWN_BUILD },
  'PATCH /api/builds/:id/lines/:lineId': { least: 'builder', note: OWN_BUILD },
  'DELETE /api/builds/:id/lines/:lineId': { least: 'builder', note: OWN_BUILD },
  'POST /api/builds/:id/reserve': { least: 'builder', note: OWN_BUILD },
  'POST /api/builds/:id/release': { least: 'builder', note: OWN_BUILD },
  'POST /api/builds/:id/draw': { least: 'builder', note: OWN_BUILD },
  'POST /api/builds/:id/return': { least: 'builder', note: OWN_BUILD },
  'GET /api/shortages': { least: 'viewer' },
  'GET /api/reservations': { least: 'viewer' },

  'POST /api/labels/items': { least: 'storekeeper' },
  'POST /api/labels/pdf': { least: 'storekeeper' },
  'GET /api/scan/resolve': { least: 'viewer' },
  'GET /api/scan/bins/:id/draw-lines': { least: 'viewer' },

  'GET /api/suppliers': { least: 'storekeeper' },
  'GET /api/suppliers/:id': { least: 'storekeeper' },
  'POST /api/suppliers': { least: 'storekeeper' },
  'PATCH /api/suppliers/:id': { least: 'storekeeper' },
  'DELETE /api/suppliers/:id': { least: 'storekeeper' },
  'POST /api/suppliers/:id/offers': { least: 'storekeeper' },
  'PATCH /api/suppliers/:id/offers/:offerId': { least: 'storekeeper' },
  'DELETE /api/suppliers/:id/offers/:offerId': { least: 'storekeeper' },
  'GET /api/orders': { least: 'storekeeper' },
  'GET /api/orders/suggestions': { least: 'storekeeper' },
  'GET /api/orders/:id': { least: 'storekeeper' },
  'GET /api/orders/:id/pdf': { least: 'storekeeper' },
  'POST /api/orders': { least: 'storekeeper' },
  'PATCH /api/orders/:id': { least: 'storekeeper' },
  'POST /api/orders/:id/send': { least: 'storekeeper' },
  'POST /api/orders/:id/receive': { least: 'storekeeper' },
  'POST /api/orders/:id/cancel': { least: 'storekeeper' },
  'POST /api/orders/:id/close': { least: 'storekeeper' },
  'GET /api/alerts': { least: 'viewer' },
  'POST /api/alerts/digest': { least: 'storekeeper' },
  'POST /api/alerts/refresh': { least: 'storekeeper' },
  'GET /api/today': { least: 'viewer' },
  'GET /api/today/:list': { least: 'viewer' },
}
