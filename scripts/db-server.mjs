// Keeps the private MariaDB running on its own (for development: several `npm test` runs can then share it).
import { startMariaDb, stopAll, log, waitForChildrenExit } from './lib/services.mjs'
await startMariaDb()
log('MariaDB is up; Ctrl-C stops it')
const stop = async () => { stopAll(); await waitForChildrenExit(); process.exit(0) }
process.on('SIGINT', stop)
process.on('SIGTERM', stop)
setInterval(() => {}, 1 << 30)
