// `npm run db:generate -- --name add_things`: drizzle-kit generate under a lock, so two people generating at
// once in one checkout cannot write the same migration number.
import { spawnSync } from 'node:child_process'
import { mkdirSync } from 'node:fs'
mkdirSync('.data', { recursive: true })
const args = process.argv.slice(2)
const r = spawnSync('flock', ['.data/db-generate.lock', 'npx', 'drizzle-kit', 'generate', ...args], { stdio: 'inherit' })
process.exit(r.status ?? 1)
