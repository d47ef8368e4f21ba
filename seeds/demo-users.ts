import type { Role } from '../shared/types/api'

/**
 * Demo sign-ins, one per role; documented in the README. Invented people of an invented society.
 * These passwords are for the demo only: change them (Admin → Users) on a real workshop's copy.
 */
export const DEMO_USERS: { username: string; displayName: string; role: Role; password: string; email: string }[] = [
  { username: 'admin', displayName: 'Tamsin Oakes (secretary)', role: 'admin', password: 'brass-admin-1', email: 'secretary@hollindale-sme.example' },
  { username: 'keeper', displayName: 'Gareth Pryce (stores)', role: 'storekeeper', password: 'brass-keeper-1', email: 'stores@hollindale-sme.example' },
  { username: 'builder', displayName: 'Nell Ashworth', role: 'builder', password: 'brass-builder-1', email: 'nell@hollindale-sme.example' },
  { username: 'viewer', displayName: 'Visiting member', role: 'viewer', password: 'brass-viewer-1', email: 'visitor@hollindale-sme.example' },
]
