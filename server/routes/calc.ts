import { Router } from 'express'

/** Workshop calculators: public and read-only. Filled in by the Workbench work. */
export const calcRouter = Router()
