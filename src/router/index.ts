import { createRouter, createWebHistory, type RouteLocationNormalized, type RouteRecordRaw } from 'vue-router'
import { prefetchBin } from '../api/prefetch'
import { useSessionStore } from '../stores/session'
import type { Role } from '../../shared/types/api'

declare module 'vue-router' {
  interface RouteMeta {
    title?: string
    /** Least role that may open the screen; signed-out users are sent to /login. */
    minRole?: Role
    /** Open to everyone, signed in or not. */
    public?: boolean
  }
}

// Views are lazy-loaded so the sign-in page and the bin page a phone opens stay small.
const routes: RouteRecordRaw[] = [
  { path: '/login', component: () => import('../views/LoginView.vue'), meta: { title: 'Sign in', public: true } },
  { path: '/', component: () => import('../views/TodayView.vue'), meta: { title: 'Today' } },
  { path: '/parts', component: () => import('../views/PartListView.vue'), meta: { title: 'Parts' } },
  { path: '/parts/by-label/:labelCode', component: () => import('../views/PartByLabelView.vue'), meta: { title: 'Part' } },
  { path: '/parts/:id', component: () => import('../views/PartDetailView.vue'), meta: { title: 'Part' } },
  { path: '/bins', component: () => import('../views/BinsView.vue'), meta: { title: 'Bins' } },
  { path: '/bins/:code', component: () => import('../views/BinDetailView.vue'), meta: { title: 'Bin' } },
  { path: '/scan', component: () => import('../views/ScanView.vue'), meta: { title: 'Scan' } },
  { path: '/stocktake', component: () => import('../views/StockTakeView.vue'), meta: { title: 'Stock-take', minRole: 'storekeeper' } },
  { path: '/labels', component: () => import('../views/LabelsView.vue'), meta: { title: 'Labels', minRole: 'storekeeper' } },
  { path: '/builds', component: () => import('../views/BuildListView.vue'), meta: { title: 'Builds' } },
  { path: '/builds/:id', component: () => import('../views/BuildDetailView.vue'), meta: { title: 'Build' } },
  { path: '/orders', component: () => import('../views/OrdersView.vue'), meta: { title: 'Orders', minRole: 'storekeeper' } },
  { path: '/suppliers', component: () => import('../views/SuppliersView.vue'), meta: { title: 'Suppliers', minRole: 'storekeeper' } },
  { path: '/workbench', component: () => import('../views/WorkbenchView.vue'), meta: { title: 'Workbench' } },
  { path: '/ledger', component: () => import('../views/LedgerView.vue'), meta: { title: 'Ledger' } },
  { path: '/admin/outbox', component: () => import('../views/OutboxView.vue'), meta: { title: 'Outbox', minRole: 'admin' } },
  { path: '/admin', component: () => import('../views/AdminView.vue'), meta: { title: 'Admin', minRole: 'admin' } },
  { path: '/account', component: () => import('../views/AccountView.vue'), meta: { title: 'My account' } },
  { path: '/:pathMatch(.*)*', component: () => import('../views/NotFoundView.vue'), meta: { title: 'Not found', public: true } },
]

export const router = createRouter({ history: createWebHistory(), routes })

/**
 * Starts fetching the target view's chunk (and, for a bin page, the bin's contents) at once:
 * vue-router would load the chunk only after the guards, and the view its data after mounting.
 */
function warm(to: RouteLocationNormalized) {
  for (const record of to.matched) {
    const load = record.components?.default
    if (typeof load === 'function' && !('render' in load) && !('setup' in load)) void (load as () => Promise<unknown>)().catch(() => undefined)
  }
  if (to.path.startsWith('/bins/') && typeof to.params.code === 'string') prefetchBin(to.params.code)
}

router.beforeEach(async (to) => {
  const session = useSessionStore()
  warm(to)
  if (!session.loaded) await session.load().catch(() => undefined)
  if (to.meta.public) return true
  if (!session.signedIn) return { path: '/login', query: { next: to.fullPath } }
  if (to.meta.minRole && !session.can(to.meta.minRole)) return { path: '/', query: { denied: to.path } }
  return true
})

router.afterEach((to) => {
  document.title = to.meta.title ? `${to.meta.title} · Binwright` : 'Binwright'
})
