import { describe, it, expect } from 'vitest'
import { isMonthDay, dayOf, isoDate, frostDates, isFrostFreeZone, ZONE_FROST_DEFAULTS } from '#shared/utils/seed-season'
import { monthDay } from '#shared/schemas/common'
import { frostDatesSchema } from '#shared/schemas/yard-document'

describe('frost dates that cannot be', () => {
  it('accepts only real days of the year', () => {
    // the Gregorian calendar: February has 28 days, 29 in leap years; April, June, September, November have 30
    for (const bad of ['02-30', '02-31', '04-31', '06-31', '09-31', '11-31', '00-10', '13-01', '01-00', '1-5', '01-32']) {
      expect(isMonthDay(bad), bad).toBe(false)
      expect(monthDay.safeParse(bad).success, bad).toBe(false)
    }
    for (const good of ['01-31', '02-28', '02-29', '04-30', '12-31']) expect(monthDay.safeParse(good).success, good).toBe(true)
    // 29 February stands for 28 February in a common year (2027), and is itself in a leap year (2028)
    expect(isoDate(dayOf(2027, '02-29'))).toBe('2027-02-28')
    expect(isoDate(dayOf(2028, '02-29'))).toBe('2028-02-29')
  })

  it('refuses a last spring frost on or after the first fall frost, naming the field', () => {
    const r = frostDatesSchema.safeParse({ lastSpring: '10-20', firstFall: '04-01' })
    expect(r.success).toBe(false)
    expect(r.error!.issues[0]!.path).toEqual(['firstFall'])
    expect(frostDatesSchema.safeParse({ lastSpring: '04-28', firstFall: '04-28' }).success).toBe(false)
    expect(frostDatesSchema.safeParse({ lastSpring: '04-28', firstFall: '10-14' }).success).toBe(true)
    expect(frostDatesSchema.safeParse({ lastSpring: '04-28', firstFall: null }).success).toBe(true)
  })

  it('never mixes an own date with a zone default into dates in the wrong order', () => {
    // zone 6 defaults 04-25 / 10-15 (from memory); an own last frost of 11-01 cannot pair with 10-15
    const f = frostDates({ lastSpringFrost: '11-01', firstFallFrost: null, zone: '6a' })
    expect(f.lastSpring! < f.firstFall!).toBe(true)
    expect(f.rough).toBe(true)
  })
})

describe('frost-free places', () => {
  it('are zone 10b and warmer (USDA 2023 Plant Hardiness Zone Map legend: 10b is 35 to 40 °F)', () => {
    expect(isFrostFreeZone('10a')).toBe(false)
    expect(isFrostFreeZone('10b')).toBe(true)
    expect(isFrostFreeZone('11a')).toBe(true)
    expect(isFrostFreeZone('13b')).toBe(true)
    expect(isFrostFreeZone('9b')).toBe(false)
    expect(isFrostFreeZone(null)).toBe(false)
  })

  it('have no frost dates unless the yard gives its own', () => {
    const f = frostDates({ zone: '11a' })
    expect(f).toMatchObject({ frostFree: true, lastSpring: null, firstFall: null, outdoorCold: false })
    // a yard's own dates mean it does get frost
    expect(frostDates({ zone: '10b', lastSpringFrost: '01-20', firstFallFrost: '12-20' })).toMatchObject({ frostFree: false, source: 'yard' })
  })

  it('keep rough frost dates for zones 1 to 10a only, each with the last frost first', () => {
    expect(Object.keys(ZONE_FROST_DEFAULTS).map(Number)).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9, 10])
    for (const d of Object.values(ZONE_FROST_DEFAULTS)) expect(d.lastSpring < d.firstFall).toBe(true)
  })
})
