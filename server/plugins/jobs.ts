// Runs due background jobs on an interval in every app instance (NUXT_JOBS_INTERVAL_MS; 0 turns it off here).
import { runDueJobs, INSTANCE_ID } from '../services/jobs'

export default defineNitroPlugin((nitroApp) => {
  const config = useRuntimeConfig()
  const intervalMs = Number(config.jobsIntervalMs)
  if (!config.databaseUrl || !(intervalMs > 0)) return
  const batch = Math.max(1, Number(config.jobsBatchSize) || 50)
  let running: Promise<void> | null = null
  let stopped = false

  function tick() {
    // one tick at a time per instance; other instances run theirs in parallel over the same table
    if (running || stopped) return
    running = runBatches().finally(() => { running = null })
  }

  async function runBatches() {
    try {
      await startupReady()
      const until = Date.now() + intervalMs * 5
      // keep going while batches come back full, within a time budget so a huge backlog does not starve shutdown
      while (!stopped && Date.now() < until) {
        const r = await runDueJobs(INSTANCE_ID, batch)
        if (r.claimed < batch) break
      }
    } catch (e) {
      console.error('[wildward] background jobs:', (e as Error).message)
    }
  }

  const timer = setInterval(tick, intervalMs)
  timer.unref?.()
  // a stopping instance (SIGTERM: Nitro awaits close hooks) finishes the jobs it has claimed and claims no more,
  // rather than leaving them claimed until another instance takes them as stale ten minutes later
  nitroApp.hooks.hook('close', async () => {
    stopped = true
    clearInterval(timer)
    await running
  })
})
