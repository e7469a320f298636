// Start-up work: make sure the organisation exists and, in demo mode, load the demo data once.
import { ensureOrganisation } from '../services/organisation'
import { loadDemoData, loadDemoDrive } from '../services/demo-data'

export default defineNitroPlugin(() => {
  const config = useRuntimeConfig()
  if (!config.databaseUrl) return
  setStartupWork((async () => {
    try {
      await ensureOrganisation()
      if (config.demoData) await onceAcrossInstances('demo-data/1', (tx) => loadDemoData(tx))
      if (config.demoData) await onceAcrossInstances('demo-drive/1', (tx) => loadDemoDrive(tx))
    } catch (e) {
      console.error('[wildward] start-up work failed:', (e as Error).message)
    }
  })())
})
