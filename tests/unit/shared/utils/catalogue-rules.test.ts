// The catalogue's mapping rules, one by one.
import { describe, it, expect } from 'vitest'
import {
  zoneFromMinTemperatureF, zoneIndex, zoneName, parseNativeStatus, regionStatus, usdaAreaForRegion, regionCodeForStateName,
  parseNoxiousStates, bareName, speciesOf, layerFromHabit, sunFromShadeTolerance, moistureFrom, soilFromTextures,
  bloomMonthsFrom, toxicityFrom, numberOrNull, defaultSpreadM, defaultSpacingM, defaultColdMoistDays, defaultSeedNeedsLight,
  defaultSeedCoat, defaultSeedlingsPerPot, isLawnSpecies, deriveFacts, refreshEstimates, USDA,
} from '#shared/utils/catalogue-rules'
import { nameKey } from '#shared/utils/species-name'

describe('hardiness zone from minimum temperature (USDA 2023 Plant Hardiness Zone Map table)', () => {
  // USDA 2023 map legend: 3b is −35 to −30 °F, 6a −10 to −5 °F, 7a 0 to 5 °F; lower bound inclusive is our stated assumption
  it('maps the issue\'s named temperatures', () => {
    expect(zoneFromMinTemperatureF(-33)).toBe('3b')
    expect(zoneFromMinTemperatureF(-10)).toBe('6a')
    expect(zoneFromMinTemperatureF(0)).toBe('7a')
  })
  it('puts a lower bound in its own zone and the value just below in the zone under it', () => {
    // USDA 2023 legend: 4a is −30 to −25 °F, 1a starts at −60 °F, 13b is 65 to 70 °F
    expect(zoneFromMinTemperatureF(-30)).toBe('4a')
    expect(zoneFromMinTemperatureF(-30.5)).toBe('3b')
    expect(zoneFromMinTemperatureF(-60)).toBe('1a')
    expect(zoneFromMinTemperatureF(65)).toBe('13b')
    expect(zoneFromMinTemperatureF(-79)).toBe('1a')
    expect(zoneFromMinTemperatureF(80)).toBe('13b')
  })
  it('round-trips every half-zone name through its index', () => {
    for (let i = 0; i < 26; i++) expect(zoneIndex(zoneName(i))).toBe(i)
    expect(zoneIndex('6a')).toBe(10)
    expect(zoneIndex('14a')).toBeNull()
    expect(zoneIndex('')).toBeNull()
  })
})

describe('native status codes (plant_native_status_codes.csv.gz)', () => {
  it('reads run-together area codes', () => {
    // plant_native_status_codes.csv.gz row for Poa pratensis
    expect(parseNativeStatus('L48(I,N)AK(NI)HI(I)PR(I)CAN(NI)GL(I,N)SPM(I)')).toEqual({ L48: 'NI', AK: 'NI', HI: 'I', PR: 'I', CAN: 'NI', GL: 'NI', SPM: 'I' })
    expect(parseNativeStatus('L48(N)CAN(N)')).toEqual({ L48: 'N', CAN: 'N' })
    // waifs and garden persistents are introduced; "?" reads as the letter it qualifies
    expect(parseNativeStatus('L48(I)CAN(W)PR(GP)HI(N?)')).toEqual({ L48: 'I', CAN: 'I', PR: 'I', HI: 'N' })
    expect(parseNativeStatus('CAN(N,W)')).toEqual({ CAN: 'N' })
  })
  it('maps regions to USDA areas', () => {
    expect(usdaAreaForRegion('US-OH')).toBe('L48')
    expect(usdaAreaForRegion('US-DC')).toBe('L48')
    expect(usdaAreaForRegion('US-AK')).toBe('AK')
    expect(usdaAreaForRegion('CA-ON')).toBe('CAN')
    expect(usdaAreaForRegion('US-GU')).toBeNull()
  })
  it('names every kind of state the distribution file uses', () => {
    expect(regionCodeForStateName('Ohio')).toBe('US-OH')
    expect(regionCodeForStateName('Newfoundland')).toBe('CA-NL')
    expect(regionCodeForStateName('Labrador')).toBe('CA-NL')
    expect(regionCodeForStateName('Navassa Island')).toBe('US-UM')
    expect(regionCodeForStateName('Palau')).toBe('US-PW')
    expect(regionCodeForStateName('Atlantis')).toBeNull()
  })
  it('decides a region status', () => {
    const ns = parseNativeStatus('L48(I,N)CAN(N)')
    expect(regionStatus({ region: 'US-OH', recorded: true, areaStatus: ns, noxious: false })).toBe('nativeAndIntroduced')
    expect(regionStatus({ region: 'CA-ON', recorded: true, areaStatus: ns, noxious: false })).toBe('native')
    expect(regionStatus({ region: 'US-OH', recorded: false, areaStatus: ns, noxious: false })).toBe('absent')
    // no code for the area: introduced; listed noxious and not plain native: invasive; a listed native stays native
    expect(regionStatus({ region: 'US-AK', recorded: true, areaStatus: ns, noxious: false })).toBe('introduced')
    expect(regionStatus({ region: 'US-OH', recorded: true, areaStatus: ns, noxious: true })).toBe('invasive')
    expect(regionStatus({ region: 'CA-ON', recorded: true, areaStatus: ns, noxious: true })).toBe('native')
    // no native-status row, or an area without codes: the distribution file's status column
    expect(regionStatus({ region: 'US-GU', recorded: true, areaStatus: ns, distributionStatus: 'native', noxious: false })).toBe('native')
    expect(regionStatus({ region: 'US-OH', recorded: true, areaStatus: null, distributionStatus: 'both', noxious: false })).toBe('nativeAndIntroduced')
  })
  it('reads state noxious lists', () => {
    // noxious_composite_2015.csv.gz rows for Berberis thunbergii and Abutilon theophrasti
    expect(parseNoxiousStates('CT (INB), MA (P)')).toEqual(['US-CT', 'US-MA'])
    expect(parseNoxiousStates('CO (CW), IA (SNW), OR (BDW, Q), WA (CAW, NWSPQ)')).toEqual(['US-CO', 'US-IA', 'US-OR', 'US-WA'])
    expect(parseNoxiousStates('')).toEqual([])
  })
})

describe('names', () => {
  it('drops authors and keeps rank words', () => {
    expect(bareName('Asclepias tuberosa L.')).toBe('Asclepias tuberosa')
    expect(bareName('Poa pratensis L. ssp. pratensis ')).toBe('Poa pratensis ssp. pratensis')
    expect(bareName('Amelanchier canadensis (L.) Medik.')).toBe('Amelanchier canadensis')
    expect(bareName('Abies balsamea (L.) Mill. var. phanerolepis Fernald')).toBe('Abies balsamea var. phanerolepis')
    expect(bareName('Ambrosia trifida L.1')).toBe('Ambrosia trifida')
    expect(bareName('Berberis L.2')).toBe('Berberis')
    expect(bareName('Equisetum ×ferrissii Clute (pro sp.) [hyemale × laevigatum]')).toBe('Equisetum ×ferrissii')
    expect(bareName('Abelia X grandiflora')).toBe('Abelia ×grandiflora')
    // plants.csv.gz and plant_native_status_codes.csv.gz: hybrid formulas and quadrinomials are their own names
    expect(bareName('Ulmus pumila × rubra [unnamed hybrid]')).toBe('Ulmus pumila ×rubra')
    expect(bareName('Ulmus pumila X rubra')).toBe('Ulmus pumila ×rubra')
    expect(bareName('Phragmites australis ssp. americanus X ssp. australis')).toBe('Phragmites australis ssp. americanus ×ssp. australis')
    expect(bareName('Agastache pallidiflora ssp. neomexicana var. havardii')).toBe('Agastache pallidiflora ssp. neomexicana var. havardii')
    expect(bareName('Cyanea st.-johnii (Hosaka) H. St. John')).toBe('Cyanea st.-johnii')
    expect(bareName('Dicranum scoparium Hedw. f. ex Brid.')).toBe('Dicranum scoparium')
  })
  it('reads a nothogenus glued to a capital X as the hybrid sign (plant_native_status_codes.csv.gz: "XAchnella caduca")', () => {
    // plants.csv.gz writes the same taxon "×Achnella caduca (Beal) Barkworth [Achnatherum hymenoides × Nassella viridula]"
    expect(bareName('XAchnella caduca')).toBe('×Achnella caduca')
    expect(nameKey(bareName('XAchnella caduca'))).toBe(nameKey(bareName('×Achnella caduca (Beal) Barkworth [Achnatherum hymenoides × Nassella viridula]')))
    expect(bareName('XAgroelymus adamsii')).toBe('×Agroelymus adamsii')
    // a genus that merely starts with X is not a hybrid
    expect(bareName('Xanthium strumarium L.')).toBe('Xanthium strumarium')
    expect(bareName('Xyris difformis Chapm.')).toBe('Xyris difformis')
  })
  it('reads "f." right before a rank word as the end of the author (filius), not a forma (plants.csv.gz rows)', () => {
    expect(bareName('Commelina diffusa Burm. f. var. diffusa ')).toBe('Commelina diffusa var. diffusa')
    expect(bareName('Commelina diffusa Burm. f. var. gigas (Small) Faden')).toBe('Commelina diffusa var. gigas')
    expect(bareName('Carex heleonastes L. f. ssp. neurochlaena (T. Holm) Böcher')).toBe('Carex heleonastes ssp. neurochlaena')
    expect(bareName('Festuca brachyphylla Schult. ex Schult. & Schult. f. ssp. brachyphylla ')).toBe('Festuca brachyphylla ssp. brachyphylla')
    // a real forma is kept
    expect(bareName('Crataegus crus-galli L. f. macra')).toBe('Crataegus crus-galli f. macra')
  })
  it('makes lookup keys that ignore case, spacing and a quoted cultivar', () => {
    expect(nameKey("Echinacea  purpurea 'Magnus'")).toBe('echinacea purpurea')
    expect(nameKey('Acer x freemanii')).toBe('acer ×freemanii')
    expect(speciesOf('poa pratensis ssp. pratensis')).toBe('poa pratensis')
  })
})

describe('layer from growth habit (USDA PLANTS growth habit definitions: trees usually over 13–16 ft)', () => {
  it('maps single habits', () => {
    expect(layerFromHabit('Tree', null)).toBe('tree')
    expect(layerFromHabit('Shrub', null)).toBe('shrub')
    expect(layerFromHabit('Subshrub', null)).toBe('shrub')
    expect(layerFromHabit('Forb/herb', null)).toBe('ground')
    expect(layerFromHabit('Graminoid', null)).toBe('ground')
    expect(layerFromHabit('Vine', null)).toBe('ground')
    expect(layerFromHabit('Nonvascular', null)).toBeNull()
    expect(layerFromHabit('', null)).toBeNull()
  })
  it('splits "Shrub, Tree" by mature height', () => {
    expect(layerFromHabit('Shrub, Tree', 25)).toBe('tree')
    expect(layerFromHabit('Shrub, Tree', 13)).toBe('tree')
    expect(layerFromHabit('Shrub, Tree', 8)).toBe('shrub')
    expect(layerFromHabit('Shrub, Tree', null)).toBe('shrub')
    // plants.csv.gz: Monarda fistulosa is "Forb/herb, Subshrub", 4.9 ft: planted as a perennial
    expect(layerFromHabit('Forb/herb, Subshrub', 1)).toBe('ground')
    expect(layerFromHabit('Forb/herb, Subshrub', 4.9)).toBe('ground')
    expect(layerFromHabit('Shrub, Subshrub', 2)).toBe('shrub')
  })
})

describe('site, bloom and other USDA facts', () => {
  it('maps shade tolerance to sun', () => {
    expect(sunFromShadeTolerance('Intolerant')).toEqual(['full'])
    expect(sunFromShadeTolerance('Intermediate')).toEqual(['full', 'part'])
    expect(sunFromShadeTolerance('Tolerant')).toEqual(['full', 'part', 'shade'])
    expect(sunFromShadeTolerance('')).toEqual([])
  })
  it('maps moisture use with drought and anaerobic tolerance', () => {
    expect(moistureFrom('Low', 'High', 'None')).toEqual(['dry', 'medium'])
    expect(moistureFrom('High', 'None', 'High')).toEqual(['wet'])
    expect(moistureFrom('Medium', 'Low', 'Medium')).toEqual(['medium', 'wet'])
    expect(moistureFrom('High', 'Medium', 'Low')).toEqual(['medium', 'wet'])
    expect(moistureFrom('', '', '')).toEqual([])
  })
  it('maps soil texture flags', () => {
    expect(soilFromTextures('TRUE', 'TRUE', 'FALSE')).toEqual(['sand', 'loam'])
    expect(soilFromTextures('FALSE', 'FALSE', 'TRUE')).toEqual(['clay'])
  })
  it('maps bloom periods to months', () => {
    expect(bloomMonthsFrom('Mid Summer')).toEqual([7])
    expect(bloomMonthsFrom('Spring')).toEqual([3, 4, 5])
    expect(bloomMonthsFrom('Winter')).toEqual([12, 1, 2])
    expect(bloomMonthsFrom('Indeterminate')).toEqual([])
  })
  it('reads toxicity and numbers as written by USDA', () => {
    expect(toxicityFrom('Severe')).toEqual({ toxic: true, toxicity: 'severe' })
    expect(toxicityFrom('None')).toEqual({ toxic: false, toxicity: 'none' })
    expect(toxicityFrom('')).toEqual({ toxic: false, toxicity: null })
    expect(numberOrNull('7e+05')).toBe(700000)
    expect(numberOrNull('')).toBeNull()
    expect(numberOrNull('NA')).toBeNull()
  })
})

describe('documented defaults for what USDA lacks (common practice, from memory)', () => {
  it('spreads by layer and height', () => {
    expect(defaultSpreadM('tree', 15)).toBe(10.05)
    expect(defaultSpreadM('tree', 3)).toBe(3)
    expect(defaultSpreadM('shrub', 2)).toBe(2)
    expect(defaultSpreadM('shrub', 10)).toBe(6)
    expect(defaultSpreadM('ground', 1)).toBe(0.6)
    expect(defaultSpreadM('ground', 0.1)).toBe(0.25)
    expect(defaultSpreadM('ground', 1, 'Rapid')).toBe(0.9)
    expect(defaultSpacingM(0.6, false)).toBe(0.6)
    expect(defaultSpacingM(0.1, true)).toBeNull()
  })
  it('seed defaults', () => {
    expect(defaultColdMoistDays('ground', true)).toBe(60)
    expect(defaultColdMoistDays('shrub', true)).toBe(90)
    expect(defaultColdMoistDays('tree', false)).toBe(0)
    expect(defaultColdMoistDays('tree', null)).toBeNull()
    expect(defaultSeedNeedsLight(3_000_000)).toBe(true)
    expect(defaultSeedNeedsLight(70_000)).toBe(false)
    expect(defaultSeedNeedsLight(null)).toBe(false)
    expect(defaultSeedCoat('Fabaceae', 'Baptisia', 'ground')).toEqual({ scarify: true, hotWaterSoak: false })
    expect(defaultSeedCoat('Fabaceae', 'Cercis', 'tree')).toEqual({ scarify: true, hotWaterSoak: true })
    expect(defaultSeedCoat('Asteraceae', 'Echinacea', 'ground')).toEqual({ scarify: false, hotWaterSoak: false })
    expect(defaultSeedlingsPerPot('ground', 500_000)).toBe(12)
    // large seed (2,000–19,999 a pound) gives at most 4 seedlings a pot, and shrubs 6 at most (common practice)
    expect(defaultSeedlingsPerPot('shrub', 5_000)).toBe(4)
    expect(defaultSeedlingsPerPot('tree', 5_000)).toBe(3)
    expect(defaultSeedlingsPerPot('tree', 100)).toBe(1)
  })
  it('knows turf grasses', () => {
    expect(isLawnSpecies('Poa pratensis')).toBe(true)
    expect(isLawnSpecies('Poa pratensis ssp. pratensis')).toBe(true)
    expect(isLawnSpecies('Schizachyrium scoparium')).toBe(false)
  })
})

describe('deriveFacts', () => {
  const plant = { scientificName: 'Asclepias tuberosa', family: 'Asclepiadaceae', genus: 'Asclepias', growthHabit: 'Forb/herb' }
  it('marks every default as estimated and names USDA for data', () => {
    const f = deriveFacts(plant, { height_mature_feet: '2', shade_tolerance: 'Intolerant', temperature_minimum_f: '-33', cold_stratification_required: 'FALSE', bloom_period: 'Mid Summer' })
    expect(f.layer).toBe('ground')
    // 2 ft × 0.3048 m/ft (exact definition), to the centimetre
    expect(f.height).toBe(0.61)
    expect(f.minZone).toBe('3b')
    expect(f.sources.height).toBe(USDA)
    expect(f.estimated).toContain('spread')
    expect(f.sources.spread).toMatch(/^estimated: /)
    expect(f.coldMoistDays).toBe(0)
    expect(f.sources.coldMoistDays).toBe(USDA)
  })
  it('without characteristics, estimates height and leaves site facts empty', () => {
    const f = deriveFacts({ ...plant, growthHabit: 'Shrub' }, null)
    expect(f.layer).toBe('shrub')
    expect(f.height).toBe(2)
    expect(f.estimated).toEqual(expect.arrayContaining(['height', 'spread', 'spacing']))
    expect(f.sun).toEqual([])
    expect(f.minZone).toBeNull()
  })
  it('recomputes estimated dependents after a coordinator change', () => {
    const f = deriveFacts({ ...plant, growthHabit: 'Shrub' }, null)
    const d = { ...f, family: plant.family, genus: plant.genus }
    d.height = 4
    d.estimated = d.estimated.filter((x) => x !== 'height')
    refreshEstimates(d, ['height'])
    expect(d.spread).toBe(4)
    expect(d.spacing).toBe(4)
    d.coldStratification = true
    refreshEstimates(d, ['coldStratification'])
    expect(d.coldMoistDays).toBe(90)
    expect(d.estimated).toContain('coldMoistDays')
  })
})
