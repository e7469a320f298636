// Start-up work: make sure the organisation exists, load the species catalogue and, in demo mode, the demo data once.
import { ensureOrganisation } from '../services/organisation'
import { loadDemoData, loadDemoDrive, loadDemoSale } from '../services/demo-data'
import { ensureCatalogue } from '../services/catalogue'
import { demoRefusal } from '../utils/demo'

export default defineNitroPlugin(() => {
  const config = useRuntimeConfig()
  const refusal = demoRefusal(process.env, !!config.demoData || !!config.public.demoMode, !!config.demoExplicit)
  if (refusal) {
    console.error(`[wildward] ${refusal}`)
    process.exit(1)
  }
  if (!config.databaseUrl) return
  setStartupWork((async () => {
    try {
      await ensureOrganisation()
      // the species catalogue, once per catalogue version across instances: onceAcrossInstances('catalogue/<version>')
      await ensureCatalogue(!!config.demoData)
      if (config.demoData) await onceAcrossInstances('demo-data/1', (tx) => loadDemoData(tx))
      if (config.demoData) await onceAcrossInstances('demo-drive/1', (tx) => loadDemoDrive(tx))
      if (config.demoData) await onceAcrossInstances('demo-sale/1', (tx) => loadDemoSale(tx))
    } catch (e) {
      console.error('[wildward] start-up work failed:', (e as Error).message)
    }
  })())
})
