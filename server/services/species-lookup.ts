import type { SpeciesFacts } from '#shared/types/species'

// The one place the score engine asks about species. Until the catalogue is loaded this answers from a small
// demo table (demo data, not a source); the catalogue replaces the body, not the signature.
const DEMO: Record<string, Omit<SpeciesFacts, 'status'> & { nativeIn: string[]; invasiveIn?: string[]; bothIn?: string[] }> = {
  'quercus alba': { scientificName: 'Quercus alba', commonName: 'white oak', layer: 'tree', spread: 20, height: 25, spacing: null, lawn: false, estimated: [], toxic: true, nativeIn: ['US-OH'] },
  'acer platanoides': { scientificName: 'Acer platanoides', commonName: 'Norway maple', layer: 'tree', spread: 12, height: 15, spacing: null, lawn: false, estimated: [], toxic: false, nativeIn: [] },
  'berberis thunbergii': { scientificName: 'Berberis thunbergii', commonName: 'Japanese barberry', layer: 'shrub', spread: 1.5, height: 1.5, spacing: null, lawn: false, estimated: [], toxic: false, nativeIn: [], invasiveIn: ['US-OH', 'US-CT', 'US-MA'] },
  'asclepias tuberosa': { scientificName: 'Asclepias tuberosa', commonName: 'butterfly milkweed', layer: 'ground', spread: 0.45, height: 0.6, spacing: 0.45, lawn: false, estimated: [], toxic: true, nativeIn: ['US-OH'] },
  'echinacea purpurea': { scientificName: 'Echinacea purpurea', commonName: 'purple coneflower', layer: 'ground', spread: 0.5, height: 0.9, spacing: 0.45, lawn: false, estimated: [], toxic: false, nativeIn: ['US-OH'] },
  'carex pensylvanica': { scientificName: 'Carex pensylvanica', commonName: 'Pennsylvania sedge', layer: 'ground', spread: 0.3, height: 0.2, spacing: 0.3, lawn: false, estimated: [], toxic: false, nativeIn: ['US-OH'] },
  'poa pratensis': { scientificName: 'Poa pratensis', commonName: 'Kentucky bluegrass', layer: 'ground', spread: 0.1, height: 0.08, spacing: null, lawn: true, estimated: [], toxic: false, nativeIn: [], bothIn: ['US-OH'] },
}

export async function loadSpeciesFacts(names: Iterable<string>, region: string): Promise<Map<string, SpeciesFacts>> {
  const out = new Map<string, SpeciesFacts>()
  for (const name of names) {
    const key = name.trim().toLowerCase()
    const d = DEMO[key]
    if (!d) continue
    const { nativeIn, invasiveIn = [], bothIn = [], ...facts } = d
    const status = invasiveIn.includes(region) ? 'invasive' : bothIn.includes(region) ? 'nativeAndIntroduced' : nativeIn.includes(region) ? 'native' : 'introduced'
    out.set(key, { ...facts, status })
  }
  return out
}
