import type { Role } from './types/api'

/** The main screens in the order a workshop uses them; each shown to `minRole` and above. */
export const NAV_ITEMS: { path: string; label: string; minRole: Role }[] = [
  { path: '/', label: 'Today', minRole: 'viewer' },
  { path: '/parts', label: 'Parts', minRole: 'viewer' },
  { path: '/bins', label: 'Bins', minRole: 'viewer' },
  { path: '/scan', label: 'Scan', minRole: 'viewer' },
  { path: '/labels', label: 'Labels', minRole: 'storekeeper' },
  { path: '/builds', label: 'Builds', minRole: 'viewer' },
  { path: '/orders', label: 'Orders', minRole: 'storekeeper' },
  { path: '/workbench', label: 'Workbench', minRole: 'viewer' },
  { path: '/ledger', label: 'Ledger', minRole: 'viewer' },
  { path: '/admin', label: 'Admin', minRole: 'admin' },
]
