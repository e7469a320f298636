// Bundles the score engine's worker thread (server/workers/score-worker.ts) into one file beside the built
// server's entry, where server/services/score-pool.ts looks for it. Called from nuxt.config.ts after Nitro builds.
import { build } from 'esbuild'
import { fileURLToPath } from 'node:url'
import { join } from 'node:path'

const root = fileURLToPath(new URL('../..', import.meta.url))

export async function bundleScoreWorker(serverDir) {
  await build({
    entryPoints: [join(root, 'server/workers/score-worker.ts')],
    outfile: join(serverDir, 'score-worker.mjs'),
    bundle: true,
    platform: 'node',
    format: 'esm',
    target: 'node20',
    alias: { '#shared': join(root, 'shared') },
    logLevel: 'warning',
  })
}
