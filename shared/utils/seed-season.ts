/**
 * The seed calendar's dates: frost dates (the yard's, or rough ones for its zone), which season a day belongs to,
 * and each species' sowing route and dates in that season. Pure; plain calendar days in UTC, written YYYY-MM-DD.
 *
 * A season is named by the year of its spring. In places with frost it starts the day after the previous first fall
 * frost (outdoor sowing for winter cold begins two weeks later) and runs until its first fall frost has passed, or
 * until its last plant-out date if that is later; the next season's plan starts after that. In frost-free places
 * (zone 10b and warmer without frost dates of its own) the plan follows the cool season: sow in mid-fall, plant out
 * in winter while rain and cool weather let roots establish, by the end of February (common practice, from memory).
 *
 * Timing rules (common practice for sowing natives in pots outdoors unless a source is named):
 * - cold-moist seed: outdoors from 14 days after the first fall frost to 15 January, and at least its N days before
 *   the last spring frost, or N days in a refrigerator at about 1–5 °C ending at the last frost (cold-moist periods
 *   of about 30–90 days at 1–5 °C: USDA Forest Service Woody Plant Seed Manual, Agriculture Handbook 727, 2008);
 * - seed whose cold need is not recorded: the same outdoor winter sowing (winter gives it a cold period if it needs
 *   one and does no harm if not), planned for 60 days; where winters are mild, 30 days in a refrigerator;
 * - seed needing no cold period: early spring (14 days either side of the last frost), or late fall (2 to 6 weeks
 *   after the first fall frost) as the other choice;
 * - seed that dies when dried: sown fresh in fall, from 4 weeks before to 4 weeks after the first fall frost, as it
 *   is collected (Agriculture Handbook 727: recalcitrant seed such as acorns and buckeyes);
 * - germination about 1–2 weeks after warm sowing, or in the 4 weeks up to the last spring frost for winter-sown
 *   pots; pot up about 6 weeks after germination; plant out from 6 weeks to 2 weeks before the first fall frost,
 *   never before pot-up (so roots establish before the ground freezes and frost heaves them).
 */

const DAY_MS = 86_400_000

export function isLeapYear(year: number): boolean {
  return (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0
}
/** Days in each month of a leap year: a frost date of 29 February is a real date in leap years. */
const MONTH_DAYS = [31, 29, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31]

/** True for a real MM-DD calendar day (02-29 counts: frost dates repeat every year, leap years included). */
export function isMonthDay(s: string): boolean {
  const m = /^(\d\d)-(\d\d)$/.exec(s)
  if (!m) return false
  const month = Number(m[1]), day = Number(m[2])
  return month >= 1 && month <= 12 && day >= 1 && day <= MONTH_DAYS[month - 1]!
}

/** A MM-DD day in `year`; 29 February in a common year is taken as 28 February. */
export function dayOf(year: number, monthDay: string): Date {
  const [m, d] = monthDay.split('-').map(Number)
  const day = m === 2 && d === 29 && !isLeapYear(year) ? 28 : d!
  return new Date(Date.UTC(year, m! - 1, day))
}
export function addDays(date: Date, days: number): Date {
  return new Date(date.getTime() + days * DAY_MS)
}
export function isoDate(date: Date): string {
  return date.toISOString().slice(0, 10)
}
export function parseIsoDate(s: string): Date {
  return new Date(`${s}T00:00:00Z`)
}
export function daysBetween(from: string | Date, to: string | Date): number {
  const a = typeof from === 'string' ? parseIsoDate(from) : from
  const b = typeof to === 'string' ? parseIsoDate(to) : to
  return Math.round((b.getTime() - a.getTime()) / DAY_MS)
}
export const minDate = (a: Date, b: Date) => (a.getTime() <= b.getTime() ? a : b)
export const maxDate = (a: Date, b: Date) => (a.getTime() >= b.getTime() ? a : b)
const after = (a: Date, b: Date) => a.getTime() > b.getTime()

// ---------------------------------------------------------------------------------------------------------------
// Frost dates

/**
 * Rough frost dates by whole hardiness zone (MM-DD), from memory of typical US extension-service tables; always
 * marked rough: a yard's own dates replace them. Zone 10b and warmer has no frost dates (frost-free).
 */
export const ZONE_FROST_DEFAULTS: Record<number, { lastSpring: string; firstFall: string }> = {
  1: { lastSpring: '06-10', firstFall: '08-25' },
  2: { lastSpring: '06-01', firstFall: '09-05' },
  3: { lastSpring: '05-25', firstFall: '09-15' },
  4: { lastSpring: '05-15', firstFall: '09-25' },
  5: { lastSpring: '05-05', firstFall: '10-05' },
  6: { lastSpring: '04-25', firstFall: '10-15' },
  7: { lastSpring: '04-10', firstFall: '10-30' },
  8: { lastSpring: '03-25', firstFall: '11-10' },
  9: { lastSpring: '02-25', firstFall: '11-30' },
  10: { lastSpring: '01-30', firstFall: '12-15' },
}
/** the zone assumed when a yard has neither frost dates nor a zone */
export const FALLBACK_ZONE = 6
/** winters in this zone and colder give seed its cold period outdoors */
export const WARMEST_ZONE_FOR_OUTDOOR_COLD = 8
/** the warmest half-zone with frost dates: USDA 2023 map, zone 10a is 30–35 °F, 10b 35–40 °F (frost rare to none) */
export const WARMEST_FROST_ZONE = '10a'

export interface FrostDates {
  /** MM-DD; null in a frost-free place */
  lastSpring: string | null
  firstFall: string | null
  /** true when the dates are the zone's (or the fallback's) defaults, not the yard's own */
  rough: boolean
  source: 'yard' | 'zone' | 'fallback' | 'frost-free'
  /** false in mild-winter zones: the cold period needs a refrigerator */
  outdoorCold: boolean
  frostFree: boolean
  zone: string | null
}

function parseZone(zone: string | null | undefined): { n: number; half: 0 | 1 } | null {
  const m = /^(\d{1,2})([ab])?$/.exec(zone ?? '')
  return m ? { n: Number(m[1]), half: m[2] === 'b' ? 1 : 0 } : null
}

/** Zone 10b and warmer (USDA 2023 map: average extreme minimum 35 °F and above): no frost dates by default. */
export function isFrostFreeZone(zone: string | null | undefined): boolean {
  const z = parseZone(zone)
  return !!z && (z.n > 10 || (z.n === 10 && z.half === 1))
}

/** A frost-date pair whose last spring frost comes before its first fall frost in the same year. */
export function frostOrderOk(lastSpring: string, firstFall: string): boolean {
  return lastSpring < firstFall
}

/** The yard's frost dates, or rough ones for its zone (zone 6 when it has neither); none in frost-free zones. */
export function frostDates(yard: { lastSpringFrost?: string | null; firstFallFrost?: string | null; zone?: string | null }): FrostDates {
  const z = parseZone(yard.zone)
  const zone = yard.zone ?? null
  const outdoorCold = z === null || z.n <= WARMEST_ZONE_FOR_OUTDOOR_COLD
  const own = (s: string | null | undefined) => (s && isMonthDay(s) ? s : null)
  const last = own(yard.lastSpringFrost), first = own(yard.firstFallFrost)
  if (last && first && frostOrderOk(last, first)) {
    return { lastSpring: last, firstFall: first, rough: false, source: 'yard', outdoorCold, frostFree: false, zone }
  }
  if (isFrostFreeZone(yard.zone)) {
    return { lastSpring: null, firstFall: null, rough: true, source: 'frost-free', outdoorCold: false, frostFree: true, zone }
  }
  const defaults = ZONE_FROST_DEFAULTS[z?.n ?? FALLBACK_ZONE] ?? ZONE_FROST_DEFAULTS[FALLBACK_ZONE]!
  let lastSpring = last ?? defaults.lastSpring, firstFall = first ?? defaults.firstFall
  // one own date that does not fit the zone's other: both from the zone
  if (!frostOrderOk(lastSpring, firstFall)) ({ lastSpring, firstFall } = defaults)
  return { lastSpring, firstFall, rough: true, source: z === null ? 'fallback' : 'zone', outdoorCold, frostFree: false, zone }
}

// ---------------------------------------------------------------------------------------------------------------
// A species' route and dates in one season

export const COLD_SOW_DAYS_AFTER_FIRST_FROST = 14
/** early winter ends here for sowing outdoors (MM-DD of the spring's year) */
export const COLD_SOW_LATEST = '01-15'
export const SPRING_SOW_DAYS_AROUND_LAST_FROST = 14
/** late fall for seed needing no cold period: 2 to 6 weeks after the first fall frost */
export const FALL_SOW_DAYS_AFTER_FIRST_FROST = [14, 42] as const
/** seed sown fresh: 4 weeks either side of the first fall frost, as it ripens and falls */
export const FRESH_SOW_DAYS_AROUND_FIRST_FROST = 28
/** cold need not recorded: outdoor winter sowing is planned for this many days of cold (mid-range of 30–90) */
export const UNKNOWN_COLD_OUTDOOR_DAYS = 60
/** cold need not recorded, mild winters: a short refrigerator period (the low end of 30–90 days) */
export const UNKNOWN_COLD_FRIDGE_DAYS = 30
export const GERMINATION_WATCH_DAYS = 28
/** germination after warm sowing: from a week after the first sowing to two weeks after the last */
export const GERMINATION_DAYS_AFTER_WARM_SOWING = [7, 14] as const
export const POT_UP_DAYS_AFTER_GERMINATION = 42
/** plant out from 6 weeks to 2 weeks before the first fall frost */
export const PLANT_OUT_DAYS_BEFORE_FROST = [42, 14] as const
/** the frost-free cool season: sow mid-fall (previous year), plant out by the end of February */
export const COOL_SEASON = { sowFrom: '10-15', sowTo: '11-30', plantOutBy: '02-28' } as const

export type ColdNeed = 'needed' | 'none' | 'unknown'
export type SowRoute = 'outdoor-winter' | 'fresh' | 'spring' | 'fridge' | 'cool-season'

export interface SeasonFrame {
  year: number
  frostFree: boolean
  outdoorCold: boolean
  /** frost-free: the cool season's sowing start and plant-out end stand in */
  lastSpring: Date | null
  firstFall: Date | null
  previousFall: Date | null
}

export function seasonFrame(year: number, frost: FrostDates): SeasonFrame {
  if (frost.frostFree || !frost.lastSpring || !frost.firstFall) {
    return { year, frostFree: true, outdoorCold: false, lastSpring: null, firstFall: null, previousFall: null }
  }
  return {
    year, frostFree: false, outdoorCold: frost.outdoorCold,
    lastSpring: dayOf(year, frost.lastSpring), firstFall: dayOf(year, frost.firstFall), previousFall: dayOf(year - 1, frost.firstFall),
  }
}

export interface Schedule {
  route: SowRoute
  /** days of cold-moist the plan gives the seed (0: none) */
  coldDays: number
  sowFrom: Date | null
  sowTo: Date | null
  /** late-fall option for seed that needs no cold period */
  altSowFrom: Date | null
  altSowTo: Date | null
  fridgeStart: Date | null
  fridgeSow: Date | null
  /** the refrigerator is the other choice while sowing outdoors is still possible */
  fridgeOptional: boolean
  germinationFrom: Date
  germination: Date
  potUp: Date
  plantOut: Date
  plantOutBy: Date
  /** pot-up comes too late to plant out this fall */
  lateForPlantOut: boolean
  notes: string[]
}

export interface ScheduleInput { coldNeed: ColdNeed; coldDays: number; fresh: boolean }

/** The refrigerator route: N days ending at `sowAt`; started today (sowing N days on) when its start has passed. */
function fridgeDates(sowAt: Date, days: number, today: Date, catchUpUntil: Date) {
  let start = addDays(sowAt, -days), sow = sowAt
  if (after(today, start) && !after(today, catchUpUntil)) { start = today; sow = addDays(today, days) }
  return { start, sow }
}

function warmGermination(sowFrom: Date, sowTo: Date) {
  return { germinationFrom: addDays(sowFrom, GERMINATION_DAYS_AFTER_WARM_SOWING[0]), germination: addDays(sowTo, GERMINATION_DAYS_AFTER_WARM_SOWING[1]) }
}

/** A species' sowing route and dates in the season `f`, as seen on `today` (a missed outdoor sowing moves to the refrigerator). */
export function scheduleSpecies(s: ScheduleInput, f: SeasonFrame, today: Date): Schedule {
  const notes: string[] = []
  const coldDays = s.coldNeed === 'needed' ? s.coldDays : s.coldNeed === 'unknown' ? (f.outdoorCold ? UNKNOWN_COLD_OUTDOOR_DAYS : UNKNOWN_COLD_FRIDGE_DAYS) : 0
  const base = { coldDays, sowFrom: null, sowTo: null, altSowFrom: null, altSowTo: null, fridgeStart: null, fridgeSow: null, fridgeOptional: false, notes }
  let out: Omit<Schedule, 'potUp' | 'plantOut' | 'plantOutBy' | 'lateForPlantOut'>

  if (f.frostFree) {
    const sowFrom = dayOf(f.year - 1, COOL_SEASON.sowFrom), sowTo = dayOf(f.year - 1, COOL_SEASON.sowTo)
    if (coldDays > 0) {
      const fr = fridgeDates(sowFrom, coldDays, today, sowTo)
      out = { ...base, route: 'fridge', fridgeStart: fr.start, fridgeSow: fr.sow, ...warmGermination(fr.sow, fr.sow) }
    } else {
      out = { ...base, route: s.fresh ? 'fresh' : 'cool-season', sowFrom, sowTo, ...warmGermination(sowFrom, sowTo) }
    }
    const potUp = addDays(out.germination, POT_UP_DAYS_AFTER_GERMINATION)
    const plantOutBy = maxDate(dayOf(f.year, COOL_SEASON.plantOutBy), potUp)
    const late = after(potUp, dayOf(f.year, COOL_SEASON.plantOutBy))
    return { ...out, potUp, plantOut: potUp, plantOutBy, lateForPlantOut: late }
  }

  const L = f.lastSpring!, F = f.firstFall!, P = f.previousFall!
  const winterGermination = (sowTo: Date, days: number) => {
    const germinationFrom = maxDate(addDays(L, -GERMINATION_WATCH_DAYS), addDays(sowTo, days))
    return { germinationFrom, germination: maxDate(L, germinationFrom) }
  }
  if (s.fresh) {
    const sowFrom = addDays(P, -FRESH_SOW_DAYS_AROUND_FIRST_FROST), sowTo = addDays(P, FRESH_SOW_DAYS_AROUND_FIRST_FROST)
    if (coldDays > 0 && !f.outdoorCold) {
      // kept moist and cold from collection, never dried, then sown
      const fridgeSow = addDays(sowFrom, coldDays)
      out = { ...base, route: 'fresh', fridgeStart: sowFrom, fridgeSow, ...warmGermination(fridgeSow, fridgeSow) }
    } else {
      out = { ...base, route: 'fresh', sowFrom, sowTo, ...winterGermination(sowTo, coldDays) }
    }
  } else if (coldDays > 0 && f.outdoorCold) {
    let sowFrom = addDays(P, COLD_SOW_DAYS_AFTER_FIRST_FROST)
    let sowTo = minDate(dayOf(f.year, COLD_SOW_LATEST), addDays(L, -coldDays))
    if (after(sowFrom, sowTo)) {
      // a cold period longer than the winter: sow as soon as it fits, which may be before the first frost
      sowFrom = sowTo
      notes.push(`A long cold period: sow outdoors by ${isoDate(sowTo)} at the latest; some seed of this kind waits a second winter.`)
    }
    const missed = after(today, sowTo) && !after(today, L)
    const fr = fridgeDates(L, coldDays, today, L)
    out = missed
      ? { ...base, route: 'fridge', fridgeStart: fr.start, fridgeSow: fr.sow, ...warmGermination(fr.sow, fr.sow) }
      : { ...base, route: 'outdoor-winter', sowFrom, sowTo, fridgeStart: fr.start, fridgeSow: fr.sow, fridgeOptional: true, ...winterGermination(sowTo, coldDays) }
  } else if (coldDays > 0) {
    notes.push('Winters here are too mild for a cold period outdoors: use the refrigerator.')
    const fr = fridgeDates(L, coldDays, today, L)
    out = { ...base, route: 'fridge', fridgeStart: fr.start, fridgeSow: fr.sow, ...warmGermination(fr.sow, fr.sow) }
  } else {
    const sowFrom = addDays(L, -SPRING_SOW_DAYS_AROUND_LAST_FROST), sowTo = addDays(L, SPRING_SOW_DAYS_AROUND_LAST_FROST)
    const alt = f.outdoorCold ? { altSowFrom: addDays(P, FALL_SOW_DAYS_AFTER_FIRST_FROST[0]), altSowTo: addDays(P, FALL_SOW_DAYS_AFTER_FIRST_FROST[1]) } : {}
    out = { ...base, ...alt, route: 'spring', sowFrom, sowTo, ...warmGermination(sowFrom, sowTo) }
  }
  const potUp = addDays(out.germination, POT_UP_DAYS_AFTER_GERMINATION)
  const plantOutBy = addDays(F, -PLANT_OUT_DAYS_BEFORE_FROST[1])
  const plantOut = maxDate(addDays(F, -PLANT_OUT_DAYS_BEFORE_FROST[0]), potUp)
  return { ...out, potUp, plantOut, plantOutBy: maxDate(plantOutBy, plantOut), lateForPlantOut: after(plantOut, plantOutBy) }
}

/** The last day of a season: its first fall frost (frost-free: its plant-out deadline) or its latest plant-out, if later. */
export function seasonEnd(f: SeasonFrame, frost: FrostDates, plantOuts: Date[]): Date {
  const end = f.frostFree ? dayOf(f.year, COOL_SEASON.plantOutBy) : dayOf(f.year, frost.firstFall!)
  return plantOuts.reduce(maxDate, end)
}
