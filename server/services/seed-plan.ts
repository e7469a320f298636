// Grow from seed on the server: reads the yard, the catalogue, the plan's settings and the prices, and hands
// them to the rules in shared/utils/seed-plan.ts; saves plan edits; builds the calendar.
import { and, eq, inArray, sql } from 'drizzle-orm'
import { createEvents, type EventAttributes } from 'ics'
import { seedPlans, seedPrices } from '../database/schema'
import type { YardRow } from '../database/schema'
import { getSpeciesDetails } from './catalogue'
import { nameKey } from '#shared/utils/species-name'
import {
  computeSeedPlan, raisedFromSeed, DEFAULT_MARGIN,
  type SeedPlan, type SeedPlanSettings, type SpeciesSetting, type SeedTask,
} from '#shared/utils/seed-plan'
import { frostDates, isoDate, parseIsoDate, addDays } from '#shared/utils/seed-season'
import type { UpdateSeedPlanBody, SeedPriceBody } from '#shared/schemas/seed'
import type { SpeciesDetails } from '#shared/types/species'
import { plantsToPlant } from '#shared/utils/score'
import { yardFacts } from './scoring'

export interface StoredSettings extends SeedPlanSettings { version: number }

export async function loadSeedSettings(yardId: number): Promise<StoredSettings> {
  const [row] = await useDb().select().from(seedPlans).where(eq(seedPlans.yardId, yardId)).limit(1)
  return row ? { margin: Number(row.margin), species: row.species ?? {}, version: row.version } : { margin: DEFAULT_MARGIN, species: {}, version: 0 }
}

export type YardSeedPlan = SeedPlan & { yardId: number; yardName: string; version: number; today: string }

/** The seed plan of a yard for the coming season counted from `today` (YYYY-MM-DD, default today in UTC). */
export async function seedPlanFor(yard: YardRow, today = isoDate(new Date())): Promise<YardSeedPlan> {
  const settings = await loadSeedSettings(yard.id)
  const plantings = yard.document?.plantings ?? []
  const names = [...new Set(plantings.map((p) => p.species?.trim()).filter((n): n is string => !!n))]
  const details = names.length ? await getSpeciesDetails(names, yard.region) : new Map<string, SpeciesDetails>()
  const detailsByKey = new Map<string, SpeciesDetails>()
  for (const [name, d] of details) detailsByKey.set(nameKey(name), d)

  // plantings to plant only (what stands there now is not raised), counted over the area the score counts
  const doc = yard.document ?? { plantings: [] }
  const counts = plantsToPlant({ ...doc, areas: doc.areas ?? [], plantings } as never, await yardFacts(doc as never, yard.region), yard.region)
  const species = [...counts].filter(([key]) => raisedFromSeed(detailsByKey.get(key)?.status))
    .map(([key, c]) => ({ key, name: c.name, plants: c.plants, cultivars: c.cultivars, facts: detailsByKey.get(key) ?? null }))

  const keys = species.map((s) => s.key)
  const priceRows = keys.length ? await useDb().select().from(seedPrices).where(inArray(seedPrices.speciesKey, keys)) : []
  const prices = new Map(priceRows.map((r) => [r.speciesKey, Number(r.pricePerGram)]))

  const frost = frostDates({
    lastSpringFrost: yard.lastSpringFrost ?? yard.document?.frost?.lastSpring ?? null,
    firstFallFrost: yard.firstFallFrost ?? yard.document?.frost?.firstFall ?? null,
    zone: yard.zone ?? yard.document?.zone ?? null,
  })
  const plan = computeSeedPlan({ today, frost, settings, species, prices })
  return { ...plan, yardId: yard.id, yardName: yard.name, version: settings.version, today }
}

/**
 * Saves margin and species settings when `version` is the stored one (0: nothing saved yet); else 409.
 * Species settings merge into the stored ones; a setting back at its default is dropped.
 */
export async function saveSeedSettings(yard: YardRow, body: UpdateSeedPlanBody): Promise<number> {
  const db = useDb()
  const current = await loadSeedSettings(yard.id)
  const stale = () => createError({ status: 409, message: 'Someone changed this seed plan after you opened it', data: { currentVersion: current.version, fields: { version: 'Out of date' } } })
  if (body.version !== current.version) throw stale()
  const species: Record<string, SpeciesSetting> = { ...current.species }
  for (const [name, setting] of Object.entries(body.species ?? {})) {
    const key = nameKey(name)
    const merged: SpeciesSetting = { ...species[key], ...setting }
    if (merged.seedlingsPerPot === null) delete merged.seedlingsPerPot
    if (merged.grow === undefined) delete merged.grow
    if (Object.keys(merged).length) species[key] = merged
    else delete species[key]
  }
  const margin = body.margin ?? current.margin
  if (current.version === 0) {
    const [result] = await db.insert(seedPlans).ignore().values({ yardId: yard.id, margin, species, version: 1 })
    // another save created the row first
    if (result.affectedRows === 0) throw stale()
    return 1
  }
  const [result] = await db.update(seedPlans).set({ margin, species, version: sql`${seedPlans.version} + 1` })
    .where(and(eq(seedPlans.yardId, yard.id), eq(seedPlans.version, body.version)))
  if (result.affectedRows === 0) throw stale()
  return body.version + 1
}

// ---------------------------------------------------------------------------------------------------------------
// Calendar

const dateArray = (iso: string): [number, number, number] => {
  const d = parseIsoDate(iso)
  return [d.getUTCFullYear(), d.getUTCMonth() + 1, d.getUTCDate()]
}

export function taskUid(yardId: number, task: SeedTask): string {
  return `${task.id}.yard-${yardId}@wildward`
}

/** All-day events, one per task on its first day; the description carries the window and the species. */
export function taskEvents(plans: Array<Pick<YardSeedPlan, 'yardId' | 'yardName' | 'tasks'>>, link: (yardId: number) => string): EventAttributes[] {
  return plans.flatMap((plan) => plan.tasks.map((task): EventAttributes => ({
    uid: taskUid(plan.yardId, task),
    title: `${task.title} (${icsLine(plan.yardName)})`,
    description: [
      task.endDate ? `From ${task.date} to ${task.endDate}.` : null,
      task.optional ? 'Only if you did not sow outdoors in time.' : null,
      task.detail,
      task.species.length ? `Species: ${task.species.join(', ')}.` : null,
      link(plan.yardId),
    ].filter(Boolean).join('\n\n'),
    start: dateArray(task.date),
    end: dateArray(isoDate(addDays(parseIsoDate(task.date), 1))),
    startInputType: 'utc',
    startOutputType: 'utc',
    categories: ['Wildward', 'Grow from seed'],
    transp: 'TRANSPARENT',
    busyStatus: 'FREE',
    url: link(plan.yardId),
  })))
}

/** Text for one iCalendar property: a CR, LF or other control character (from a yard name) would start a line of its own. */
export function icsLine(text: string): string {
  // eslint-disable-next-line no-control-regex
  return text.replace(/[\u0000-\u001f\u007f\u2028\u2029]+/g, ' ').trim()
}

export function calendarText(events: EventAttributes[], calName: string): string {
  calName = icsLine(calName)
  // an empty calendar is still a valid one (ics refuses an empty list)
  if (!events.length) return ['BEGIN:VCALENDAR', 'VERSION:2.0', 'PRODID:-//Wildward//Grow from seed//EN', `X-WR-CALNAME:${calName}`, 'END:VCALENDAR', ''].join('\r\n')
  const { error, value } = createEvents(events, { productId: '-//Wildward//Grow from seed//EN', calName })
  if (error || !value) throw createError({ status: 500, message: `Could not build the calendar: ${error?.message ?? 'no output'}` })
  return value
}

// ---------------------------------------------------------------------------------------------------------------
// Seed prices (coordinator)

export async function setSeedPrice(user: { id: number }, body: SeedPriceBody) {
  const db = useDb()
  const details = await getSpeciesDetails([body.scientificName], 'US-OH')
  const found = details.get(nameKey(body.scientificName))
  if (!found) throw createError({ status: 400, message: 'That species is not in the catalogue', data: { fields: { scientificName: 'Not in the catalogue' } } })
  const key = nameKey(found.scientificName)
  if (body.pricePerGram === null) {
    await db.delete(seedPrices).where(eq(seedPrices.speciesKey, key))
    return { scientificName: found.scientificName, pricePerGram: null }
  }
  await db.insert(seedPrices).values({ speciesKey: key, scientificName: found.scientificName, pricePerGram: body.pricePerGram, setBy: user.id })
    .onDuplicateKeyUpdate({ set: { pricePerGram: body.pricePerGram, setBy: user.id } })
  return { scientificName: found.scientificName, pricePerGram: body.pricePerGram }
}
