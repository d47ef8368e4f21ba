import { describe, expect, it } from 'vitest'
import { msUntilHour } from '../../../server/services/notifications'

describe('the daily digest timer', () => {
  it('waits until the hour later the same day', () => {
    const now = new Date(2025, 5, 30, 5, 30, 0)
    expect(msUntilHour(7, now)).toBe(90 * 60_000)
  })
  it('waits until tomorrow once the hour has passed (or is now)', () => {
    expect(msUntilHour(7, new Date(2025, 5, 30, 7, 0, 0))).toBe(24 * 3_600_000)
    expect(msUntilHour(7, new Date(2025, 5, 30, 19, 0, 0))).toBe(12 * 3_600_000)
  })
})
