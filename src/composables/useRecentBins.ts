import { ref } from 'vue'

/** How many recently opened bins the scan page lists. */
const RECENT_MAX = 8
const KEY = 'binwright.recentBins'

export interface RecentBin {
  code: string
  description: string
  /** ISO time it was last opened. */
  at: string
}

function read(): RecentBin[] {
  try {
    const list = JSON.parse(localStorage.getItem(KEY) ?? '[]')
    return Array.isArray(list) ? list.filter((b) => typeof b?.code === 'string').slice(0, RECENT_MAX) : []
  } catch {
    return []
  }
}

/** Bins opened on this device, newest first (kept in localStorage: a phone is one person's). */
export function useRecentBins() {
  const bins = ref<RecentBin[]>(read())
  function remember(code: string, description: string) {
    bins.value = [{ code, description, at: new Date().toISOString() }, ...read().filter((b) => b.code !== code)].slice(0, RECENT_MAX)
    localStorage.setItem(KEY, JSON.stringify(bins.value))
  }
  function clear() {
    bins.value = []
    localStorage.removeItem(KEY)
  }
  return { bins, remember, clear }
}
