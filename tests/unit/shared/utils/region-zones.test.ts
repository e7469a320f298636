// Cold hardiness estimated from where a species is native, by each region's coldest USDA zone (table from memory).
import { describe, it, expect } from 'vitest'
import { COLDEST_ZONE, hardinessFromRange, withRangeHardiness, RANGE_ESTIMATE } from '#shared/utils/region-zones'
import { zoneIndex } from '#shared/utils/catalogue-rules'
import { REGIONS } from '#shared/utils/regions'

describe('coldest zone per region', () => {
  it('covers every state, territory and province the catalogue knows, with a USDA zone of the 2023 map\'s range', () => {
    for (const code of Object.keys(REGIONS)) expect(zoneIndex(COLDEST_ZONE[code]), code).not.toBeNull()
  })
  it('orders a few regions as the map does (from memory: Minnesota colder than Ohio, Ohio colder than Georgia, Florida warmest of the lower 48 listed)', () => {
    const z = (r: string) => zoneIndex(COLDEST_ZONE[r])!
    expect(z('US-MN')).toBeLessThan(z('US-OH'))
    expect(z('US-OH')).toBeLessThan(z('US-GA'))
    expect(z('US-GA')).toBeLessThan(z('US-FL'))
  })
})

describe('hardiness from the native range', () => {
  it('takes the coldest region where the species is native and names it', () => {
    const r = hardinessFromRange(['US-OH', 'US-MN', 'US-GA'])!
    expect(r.zone).toBe(COLDEST_ZONE['US-MN'])
    expect(r.region).toBe('US-MN')
    expect(r.source.startsWith(RANGE_ESTIMATE)).toBe(true)
    expect(r.source).toContain('Minnesota')
  })
  it('leaves out the provinces and Alaska, which reach the Arctic, unless the species is native nowhere else', () => {
    expect(hardinessFromRange(['US-OH', 'CA-QC'])!.region).toBe('US-OH')
    expect(hardinessFromRange(['CA-QC', 'CA-ON'])!.zone).toBe('1a')
    expect(hardinessFromRange([])).toBeNull()
  })
  it('fills only a missing minimum zone, marked estimated', () => {
    const e = withRangeHardiness({ minZone: null as string | null, regions: { 'US-OH': 'native' as const, 'US-WI': 'native' as const, 'US-MN': 'introduced' as const }, sources: {} as Record<string, string>, estimated: [] as string[] })
    // Minnesota is left out: introduced there
    expect(e.minZone).toBe(COLDEST_ZONE['US-WI'])
    expect(e.estimated).toContain('minZone')
    expect(e.sources.minZone).toMatch(/^estimated from its native range: native in Wisconsin/)
    const usda = withRangeHardiness({ minZone: '4a', regions: { 'US-MN': 'native' as const }, sources: { minZone: 'USDA PLANTS' }, estimated: [] as string[] })
    expect(usda.minZone).toBe('4a')
    expect(usda.estimated).toEqual([])
  })
})
