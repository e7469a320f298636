// A worker thread's entry: runs score tasks posted by server/services/score-pool.ts, one at a time.
// Bundled on its own beside the built server (scripts/lib/score-worker.mjs).
import { parentPort } from 'node:worker_threads'
import { runScoreTask, type ScoreTask } from './score-tasks'

parentPort!.on('message', (task: ScoreTask) => {
  try {
    parentPort!.postMessage({ ok: true, value: runScoreTask(task) })
  } catch (e) {
    parentPort!.postMessage({ ok: false, message: (e as Error).message })
  }
})
