// The private MariaDB that `npm start` runs (scripts/start.mjs calls startMariaDb() with its defaults) flushes
// InnoDB's log at every commit, so a commit survives the machine stopping; only tests and benchmarks relax it.
// A throwaway server in a temporary data directory on a free port, started the way the scripts start it.
import { describe, it, expect, beforeAll, afterAll } from 'vitest'
import { spawnSync } from 'node:child_process'
import { mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'

const dataDir = mkdtempSync(join(tmpdir(), 'ww-durable-'))
let services: typeof import('../../../scripts/lib/services.mjs')

beforeAll(async () => {
  // DATA and the port are read when the module loads and when the server starts
  process.env.WW_DATA_DIR = dataDir
  services = await import('../../../scripts/lib/services.mjs')
  process.env.WW_DB_PORT = String(await services.freePort())
})

afterAll(async () => {
  services?.stopAll()
  await services?.waitForChildrenExit()
  rmSync(dataDir, { recursive: true, force: true })
})

function flushSetting(socket: string): string {
  const r = spawnSync('mariadb', ['--no-defaults', `--socket=${socket}`, '-uroot', '-N', '-e', 'SELECT @@innodb_flush_log_at_trx_commit'], { encoding: 'utf8' })
  expect(r.status, r.stderr).toBe(0)
  return r.stdout.trim()
}

describe('private MariaDB durability', () => {
  it('npm start\'s server flushes at every commit; a test run\'s may not, until npm start reuses it', async () => {
    // 1 = write and flush the log at each commit (InnoDB's default); 2 = flush about once a second
    // (MariaDB Knowledge Base, "InnoDB System Variables": innodb_flush_log_at_trx_commit)
    const relaxed = await services.startMariaDb({ durable: false })
    expect(flushSetting(relaxed.socket)).toBe('2')
    const reused = await services.startMariaDb()
    expect(reused.socket).toBe(relaxed.socket)
    expect(flushSetting(reused.socket)).toBe('1')
    services.stopAll()
    await services.waitForChildrenExit()

    const fresh = await services.startMariaDb()
    expect(flushSetting(fresh.socket)).toBe('1')
  }, 120_000)
})
