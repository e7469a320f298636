// The score engine, and the checking of document-sized bodies, run off the event loop: a few worker threads
// take tasks in turn, so a yard with thousands of outline points never holds up other requests (GET /api/health
// keeps answering). Each task has
// a time limit; a worker past it is stopped and replaced, and the request gets a clear 422. The workers keep
// nothing between tasks: every task brings its document, facts and goal.
import { Worker } from 'node:worker_threads'
import { existsSync } from 'node:fs'
import { availableParallelism } from 'node:os'
import { dirname, join } from 'node:path'
import { fileURLToPath } from 'node:url'
import type { H3Event } from 'h3'
import type { z } from 'zod'
import type { Score } from '#shared/schemas/score'
import { BODY_SCHEMAS, runScoreTask, type BodySchemaName, type ScoreTask, type YardShares } from '../workers/score-tasks'
import { checkJsonBody, type BodyCheck } from '../utils/json-body'
import { answerOf } from '../utils/validate'

/** The longest one yard may take to score on the server. */
export const SCORE_TIME_LIMIT_MS = Number(process.env.WW_SCORE_TIME_LIMIT_MS) || 20_000
/** Tasks waiting for a worker beyond this are refused with 503 (the server is busy scoring). */
export const SCORE_MAX_WAITING = 32
// one core stays with the event loop
const POOL_SIZE = Math.max(1, Math.min(4, availableParallelism() - 1))
export const WORKER_FILE = 'score-worker.mjs'

interface Job { task: ScoreTask; resolve: (v: unknown) => void; reject: (e: unknown) => void }
interface Slot { worker: Worker | null; job: Job | null; timer: ReturnType<typeof setTimeout> | null }

const slots: Slot[] = []
const waiting: Job[] = []
let file: string | null | undefined

// the bundled worker sits beside the built server's entry (Nitro puts this module in a chunk below it)
function workerFile(): string | null {
  if (file !== undefined) return file
  let dir = dirname(fileURLToPath(import.meta.url))
  for (let i = 0; i < 4 && file === undefined; i++, dir = dirname(dir)) if (existsSync(join(dir, WORKER_FILE))) file = join(dir, WORKER_FILE)
  file ??= null
  if (!file) console.warn(`[wildward] ${WORKER_FILE} was not built: scoring runs on the event loop (development only)`)
  return file
}

const tooLong = () => createError({
  status: 422,
  message: `This yard is too intricate to score within ${SCORE_TIME_LIMIT_MS / 1000} s (many overlapping outlines with many points); simplify the overlapping drifts and try again`,
  data: { fields: { document: 'Too intricate to score' } },
})

function finish(slot: Slot, settle: (job: Job) => void) {
  const job = slot.job
  if (slot.timer) clearTimeout(slot.timer)
  slot.job = null
  slot.timer = null
  if (job) settle(job)
  const next = waiting.shift()
  if (next) start(slot, next)
}

function spawn(slot: Slot, path: string): Worker {
  const w = new Worker(path)
  w.unref()
  w.on('message', (m: { ok: boolean; value?: unknown; message?: string }) => {
    if (slot.worker === w) finish(slot, (job) => (m.ok ? job.resolve(m.value) : job.reject(new Error(m.message))))
  })
  // a crashed worker fails its task; the next task starts a fresh one
  const lost = (e: unknown) => {
    if (slot.worker !== w) return
    slot.worker = null
    finish(slot, (job) => job.reject(e instanceof Error ? e : new Error('the score worker stopped')))
  }
  w.on('error', lost)
  w.on('exit', lost)
  return w
}

function start(slot: Slot, job: Job) {
  slot.worker ??= spawn(slot, file!)
  slot.job = job
  slot.timer = setTimeout(() => {
    const w = slot.worker
    slot.worker = null
    void w?.terminate()
    finish(slot, (j) => j.reject(tooLong()))
  }, SCORE_TIME_LIMIT_MS)
  slot.worker.postMessage(job.task)
}

function run(task: ScoreTask): Promise<unknown> {
  if (!workerFile()) return Promise.resolve().then(() => runScoreTask(task))
  return new Promise((resolve, reject) => {
    const job: Job = { task, resolve, reject }
    while (slots.length < POOL_SIZE) slots.push({ worker: null, job: null, timer: null })
    const idle = slots.find((s) => !s.job)
    if (idle) return start(idle, job)
    if (waiting.length >= SCORE_MAX_WAITING) {
      return reject(createError({ status: 503, message: 'The server is busy scoring other yards; try again shortly' }))
    }
    waiting.push(job)
  })
}

/** The engine's score of a document, worked out in a worker thread. */
export const scoreInWorker = (task: Omit<ScoreTask & { kind: 'score' }, 'kind'>) => run({ kind: 'score', ...task }) as Promise<Score>

/** The shares kept on a pledge and the visible lawn area, worked out in a worker thread. */
export const sharesInWorker = (task: Omit<ScoreTask & { kind: 'shares' }, 'kind'>) => run({ kind: 'shares', ...task }) as Promise<YardShares>

// below this a body is parsed on the event loop: handing it to a worker would cost more than parsing it
const SMALL_BODY_CHARS = 64 * 1024

/**
 * A document-sized JSON body, parsed and checked in a worker thread (the largest yard takes about half a
 * second to check); the same answer as `readBodyWith`, a 400 naming the fields when it fails.
 */
export async function readBodyInWorker<N extends BodySchemaName>(event: H3Event, schema: N): Promise<z.infer<(typeof BODY_SCHEMAS)[N]>> {
  const raw = await readRawBody(event, 'utf8')
  if (!raw || raw.length < SMALL_BODY_CHARS) return answerOf(checkJsonBody(BODY_SCHEMAS[schema], raw) as BodyCheck<z.infer<(typeof BODY_SCHEMAS)[N]>>)
  return answerOf((await run({ kind: 'body', schema, raw })) as BodyCheck<z.infer<(typeof BODY_SCHEMAS)[N]>>)
}
