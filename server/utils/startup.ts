// One-time work each app instance does at start (organisation row, demo data, catalogue load). Health waits
// for it, so a load balancer or a test sees the instance as ready only when it is.
let ready: Promise<void> = Promise.resolve()

export function setStartupWork(work: Promise<void>) {
  ready = work
}

export function startupReady(): Promise<void> {
  return ready
}

/**
 * Runs `work` once across every instance sharing the database: the marker row and the work commit together,
 * and a second instance's insert waits on the first's lock, then finds the key taken and skips.
 */
export async function onceAcrossInstances(key: string, work: (tx: Parameters<Parameters<Db['transaction']>[0]>[0]) => Promise<unknown>) {
  const { appMeta } = schema
  await useDb().transaction(async (tx) => {
    const [result] = await tx.insert(appMeta).ignore().values({ key, value: { at: new Date().toISOString() } })
    if (result.affectedRows === 0) return
    await work(tx)
  })
}
