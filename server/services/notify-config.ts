import { loadConfig, type Config } from '../config'

let current: Config | undefined

/** The config alerts, digests and order e-mails read (links, recipients, expiry window). */
export const setNotifyConfig = (config: Config) => { current = config }
export const notifyConfig = (): Config => (current ??= loadConfig({}))
