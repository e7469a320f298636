// The one matching rule for species names: fold case and accents (Unicode NFD), read × as x, rank how a name matches.
import { describe, it, expect } from 'vitest'
import { foldName, matchQuality, nameKey, compareNames } from '#shared/utils/species-name'

describe('folding names for search', () => {
  it('drops accents by Unicode NFD and folds case', () => {
    // USDA PLANTS common name of Triglochin gaspensis: "Gaspé Peninsula arrowgrass"
    expect(foldName('Gaspé Peninsula arrowgrass')).toBe('gaspe peninsula arrowgrass')
    expect(foldName('GASPE')).toBe('gaspe')
    // a precomposed é (U+00E9) and e + combining acute (U+0065 U+0301) fold alike
    expect(foldName('Gasp\u00e9')).toBe(foldName('Gaspe\u0301'))
  })
  it('reads the hybrid sign as the letter x, as a word of its own', () => {
    expect(foldName('Acer ×freemanii')).toBe('acer x freemanii')
    expect(foldName('Acer x freemanii')).toBe('acer x freemanii')
    expect(foldName('×Achnella caduca')).toBe('x achnella caduca')
    expect(foldName('  Echinacea   purpurea ')).toBe('echinacea purpurea')
  })
})

describe('how well a name matches', () => {
  it('ranks the whole name, its start, a word start and inside a word', () => {
    expect(matchQuality('common milkweed', 'common milkweed')).toBe(4)
    expect(matchQuality('common milkweed', 'comm')).toBe(3)
    expect(matchQuality('common milkweed', 'milkweed')).toBe(2)
    expect(matchQuality('oval-leaf milkweed', 'leaf')).toBe(2)
    expect(matchQuality('swamp milkweed', 'weed')).toBe(1)
    expect(matchQuality('swamp milkweed', 'aster')).toBe(0)
    // a later occurrence at a word start counts
    expect(matchQuality('milkweed weed', 'weed')).toBe(2)
  })
})

describe('the one lookup key and the one sort', () => {
  it('keys names without case, spacing, cultivar or hybrid spelling', () => {
    expect(nameKey("Echinacea  purpurea 'Magnus'")).toBe('echinacea purpurea')
    expect(nameKey('Acer X freemanii')).toBe(nameKey('Acer ×freemanii'))
  })
  it('sorts letters before case and accents (Intl.Collator, en-US)', () => {
    expect(['zinnia', 'Aster', 'échinacea', 'Echinacea'].sort(compareNames)).toEqual(['Aster', 'échinacea', 'Echinacea', 'zinnia'])
  })
})
