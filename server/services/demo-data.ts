// The invented demo scenario: a volunteer group in a made-up town, three demo accounts (password
// "wildward-demo", demo only) and two yards. Nothing here describes a real person, group or place.
import { eq } from 'drizzle-orm'
import { users, yards, yardMembers, organisation } from '../database/schema'
import type { YardDocument } from '#shared/schemas/yard-document'
import { YARD_FORMAT } from '#shared/schemas/yard-document'

export const DEMO_PASSWORD = 'wildward-demo'
export const DEMO_ORGANISATION = 'Bramblewick Native Yards Circle'
export const DEMO_TOWN = 'Alderwick Crossing'

export const DEMO_ACCOUNTS = [
  { email: 'homeowner@example.org', name: 'Robin Quarrendon', role: 'homeowner' },
  { email: 'advisor@example.org', name: 'Sam Fennimore', role: 'advisor' },
  { email: 'coordinator@example.org', name: 'Jo Birchall', role: 'coordinator' },
] as const

const rect = (x: number, y: number, w: number, h: number): [number, number][] => [[x, y], [x + w, y], [x + w, y + h], [x, y + h]]

/** A suburban lot, 18 m × 36 m: house, drive, lawn everywhere else, one bed with a start on natives. */
export function demoFrontYard(): YardDocument {
  return {
    format: YARD_FORMAT,
    name: 'Larch Lane front and back',
    region: 'US-OH',
    zone: '6a',
    frost: { lastSpring: '04-28', firstFall: '10-14' },
    units: 'ft',
    boundary: rect(0, 0, 18, 36),
    areas: [
      { id: 'house', kind: 'building', z: 10, points: rect(4, 12, 10, 9), label: 'House' },
      { id: 'drive', kind: 'paving', z: 9, points: rect(14, 14, 4, 22), label: 'Drive' },
      { id: 'walk', kind: 'paving', z: 9, points: rect(8, 21, 1.5, 15), label: 'Front walk' },
      { id: 'bed-south', kind: 'bed', z: 5, points: rect(1, 23, 6, 4), sun: 'full', soil: 'clay', moisture: 'medium', label: 'Front bed' },
      { id: 'bed-back', kind: 'bed', z: 5, points: rect(1, 1, 16, 3), sun: 'part', soil: 'loam', moisture: 'medium', label: 'Back fence bed' },
    ],
    plantings: [
      { id: 'lawn', species: 'Poa pratensis', points: rect(0, 0, 18, 36), z: 0, spacing: null, height: 0.08, label: 'Lawn' },
      { id: 'oak', species: 'Quercus alba', x: 4, y: 6, count: 1, spread: 9, height: 15 },
      { id: 'maple', species: 'Acer platanoides', x: 12, y: 30, count: 1, spread: 8, height: 12, label: 'Street-side maple' },
      { id: 'barberry', species: 'Berberis thunbergii', x: 11, y: 22.5, count: 3, spread: 1.2, height: 1.2 },
      { id: 'milkweed', species: 'Asclepias tuberosa', x: 2.5, y: 25, count: 5, spread: 0.45, height: 0.6 },
      { id: 'coneflower', species: 'Echinacea purpurea', cultivar: 'Sunset Lantern', x: 5, y: 25, count: 3, spread: 0.5, height: 0.9 },
      { id: 'sedge', species: 'Carex pensylvanica', points: rect(2, 1.5, 8, 2), z: 6, spacing: 0.3, height: 0.2 },
      { id: 'aster-drift', species: 'Symphyotrichum novae-angliae', points: rect(11, 1.5, 5, 2), z: 6, spacing: 0.6, height: 1.2, label: 'Aster drift' },
      { id: 'mystery', species: null, x: 15, y: 2.5, count: 1, spread: 1.5, height: 1.5, label: 'Shrub by the shed (unknown)' },
    ],
    lines: [{ id: 'wires', kind: 'overhead', points: [[0, 35], [18, 35]], label: 'Service wires' }],
  }
}

/** A small back garden already well on its way. */
export function demoBackGarden(): YardDocument {
  return {
    format: YARD_FORMAT,
    name: 'Millrace Court garden',
    region: 'US-OH',
    zone: '6a',
    frost: { lastSpring: '04-25', firstFall: '10-18' },
    units: 'm',
    boundary: rect(0, 0, 15, 20),
    areas: [
      { id: 'house', kind: 'building', z: 10, points: rect(2, 14, 11, 6), label: 'House' },
      { id: 'patio', kind: 'paving', z: 9, points: rect(4, 11, 6, 3), label: 'Patio' },
      { id: 'meadow-bed', kind: 'bed', z: 5, points: rect(0.5, 0.5, 14, 6), sun: 'full', soil: 'loam', moisture: 'dry', label: 'Meadow bed' },
      { id: 'rain', kind: 'bed', z: 5, points: rect(11, 8, 3.5, 3), sun: 'full', soil: 'clay', moisture: 'wet', label: 'Rain garden' },
    ],
    plantings: [
      { id: 'lawn', species: 'Poa pratensis', points: rect(0, 0, 15, 14), z: 0, spacing: null, height: 0.08, label: 'Lawn' },
      { id: 'meadow', species: 'Schizachyrium scoparium', points: rect(0.5, 0.5, 14, 6), z: 6, spacing: 0.45, height: 0.9 },
      { id: 'asters', species: 'Symphyotrichum novae-angliae', x: 3, y: 3, count: 7, spread: 0.6, height: 1.2 },
      { id: 'serviceberry', species: 'Amelanchier arborea', x: 1.5, y: 9, count: 1, spread: 5, height: 7 },
      { id: 'swamp-milkweed', species: 'Asclepias incarnata', x: 12.5, y: 9.5, count: 4, spread: 0.6, height: 1.2 },
      { id: 'hosta', species: 'Hosta plantaginea', x: 8, y: 12.5, count: 2, spread: 0.8, height: 0.5 },
    ],
    lines: [],
  }
}

type Tx = Parameters<Parameters<Db['transaction']>[0]>[0]

export async function loadDemoData(tx: Tx) {
  await tx.update(organisation).set({ name: DEMO_ORGANISATION })
  const passwordHash = await hashPassword(DEMO_PASSWORD)
  const ids: Record<string, number> = {}
  for (const a of DEMO_ACCOUNTS) {
    const [existing] = await tx.select({ id: users.id }).from(users).where(eq(users.email, a.email))
    if (existing) ids[a.role] = existing.id
    else ids[a.role] = (await tx.insert(users).values({ ...a, passwordHash }).$returningId())[0]!.id
  }
  for (const doc of [demoFrontYard(), demoBackGarden()]) {
    const id = insertedId(await tx.insert(yards).values({
      ownerId: ids.homeowner!, name: doc.name!, region: doc.region!, zone: doc.zone ?? null, units: doc.units,
      lastSpringFrost: doc.frost?.lastSpring ?? null, firstFallFrost: doc.frost?.firstFall ?? null, document: doc,
    }).$returningId())
    // the advisor helps on the first yard
    if (doc.name === 'Larch Lane front and back') await tx.insert(yardMembers).values({ yardId: id, userId: ids.advisor!, role: 'editor' })
  }
}

// The demo pledge drive: running now, with the demo homeowner's two yards and four invented households pledged,
// and a snapshot at each pledge and one after planting, so the dashboard's charts have real history.
const DEMO_HOUSEHOLDS = [
  { email: 'household-penhallow@example.org', name: 'Ash Penhallow', neighbourhood: 'Millrace', bed: 0.2, daysAgo: 36 },
  { email: 'household-marchbank@example.org', name: 'Lee Marchbank', neighbourhood: 'Millrace', bed: 0.95, daysAgo: 30 },
  { email: 'household-greaves@example.org', name: 'Toni Greaves', neighbourhood: 'Larch Hill', bed: 0.5, daysAgo: 21 },
  { email: 'household-oldacre@example.org', name: 'Kit Oldacre', neighbourhood: 'Larch Hill', bed: 0.9, daysAgo: 12 },
] as const

/** A 20 m × 30 m lot of lawn with a house and a native sedge bed across the front `share` of the 20 m before the house. */
function demoHouseholdYard(name: string, share: number): YardDocument {
  const depth = Math.max(1, Math.round(20 * share * 10) / 10)
  return {
    format: YARD_FORMAT, name, region: 'US-OH', zone: '6a', units: 'ft', boundary: rect(0, 0, 20, 30),
    areas: [{ id: 'house', kind: 'building', z: 10, points: rect(3, 20, 14, 8), label: 'House' }, { id: 'bed', kind: 'bed', z: 5, points: rect(0, 0, 20, depth), label: 'Meadow bed' }],
    plantings: [
      { id: 'lawn', species: 'Poa pratensis', points: rect(0, 0, 20, 30), z: 0, spacing: null, height: 0.08, label: 'Lawn' },
      { id: 'meadow', species: 'Carex pensylvanica', points: rect(0, 0, 20, depth), z: 6, spacing: 0.3, height: 0.2 },
    ],
    lines: [],
  }
}

export async function loadDemoDrive(tx: Tx) {
  const { drives, pledges, shareSnapshots } = await import('../database/schema')
  const { yardShares } = await import('./drives')
  const day = (offset: number) => new Date(Date.now() + offset * 86_400_000).toISOString().slice(0, 10)
  const driveId = insertedId(await tx.insert(drives).values({ name: `${DEMO_TOWN} native yards pledge`, startsOn: day(-45), endsOn: day(140), goal: 0.7, certifies: 'area', target: 25 }).$returningId())
  const [owner] = await tx.select({ id: users.id }).from(users).where(eq(users.email, DEMO_ACCOUNTS[0].email))
  const entries: Array<{ yardId: number; userId: number; region: string; before: YardDocument; after: YardDocument; neighbourhood: string; daysAgo: number }> = []
  if (owner) {
    for (const y of await tx.select().from(yards).where(eq(yards.ownerId, owner.id))) {
      const front = y.name === 'Larch Lane front and back'
      entries.push({ yardId: y.id, userId: owner.id, region: y.region, before: y.document, after: y.document, neighbourhood: front ? 'Larch Hill' : 'Millrace', daysAgo: front ? 40 : 27 })
    }
  }
  const passwordHash = await hashPassword(`not-a-login-${Math.random()}-${Date.now()}`)
  for (const h of DEMO_HOUSEHOLDS) {
    const [existing] = await tx.select({ id: users.id }).from(users).where(eq(users.email, h.email))
    const userId = existing?.id ?? insertedId(await tx.insert(users).values({ email: h.email, name: h.name, passwordHash }).$returningId())
    const after = demoHouseholdYard(`${h.name.split(' ')[1]} yard`, h.bed)
    const yardId = insertedId(await tx.insert(yards).values({ ownerId: userId, name: after.name!, region: 'US-OH', zone: '6a', units: 'ft', document: after }).$returningId())
    entries.push({ yardId, userId, region: 'US-OH', before: demoHouseholdYard(after.name!, 0.1), after, neighbourhood: h.neighbourhood, daysAgo: h.daysAgo })
  }
  for (const e of entries) {
    const cols = (s: Awaited<ReturnType<typeof yardShares>>) => ({
      countNative: s.shares.count.native, countTotal: s.shares.count.total, countShare: s.shares.count.share ?? 0,
      areaNative: s.shares.area.native, areaTotal: s.shares.area.total, areaShare: s.shares.area.share ?? 0,
      volumeNative: s.shares.volume.native, volumeTotal: s.shares.volume.total, volumeShare: s.shares.volume.share ?? 0, lawnArea: s.lawnArea,
    })
    const before = cols(await yardShares(e.before, e.region))
    const after = cols(await yardShares(e.after, e.region))
    await tx.insert(pledges).values({
      driveId, yardId: e.yardId, userId: e.userId, neighbourhood: e.neighbourhood, consent: true, pledgedOn: day(-e.daysAgo), ...after,
      status: after.areaShare >= 0.7 ? 'reached' : 'pledged', baseAreaNative: before.areaNative, baseLawnArea: before.lawnArea, baseShare: before.areaShare,
    })
    await tx.insert(shareSnapshots).values({ yardId: e.yardId, day: day(-e.daysAgo), ...before })
    if (e.after !== e.before) await tx.insert(shareSnapshots).values({ yardId: e.yardId, day: day(-Math.floor(e.daysAgo / 2)), ...after })
  }
}

// The demo seed sale: open now, two pickups at coined places, mail with a flat fee, lots for the demo yards' natives
// collected at coined places.
export const DEMO_SALE_LOTS = [
  { scientificName: 'Asclepias tuberosa', collected: 'wild-collected, Alderwick County roadside prairie, fall 2026', seedsPerPacket: 50, priceMinor: 400, stock: 40 },
  { scientificName: 'Echinacea purpurea', collected: 'wild-collected, Bramble Fen meadow, fall 2026', seedsPerPacket: 100, priceMinor: 350, stock: 60 },
  { scientificName: 'Carex pensylvanica', collected: 'wild-collected, Millrace woods, early summer 2026', seedsPerPacket: 200, priceMinor: 500, stock: 25 },
  { scientificName: 'Rudbeckia hirta', collected: 'volunteer garden, Larch Hill, fall 2026', seedsPerPacket: 300, priceMinor: 300, stock: 50 },
  { scientificName: 'Monarda fistulosa', collected: 'wild-collected, Alderwick County, fall 2026', seedsPerPacket: 150, priceMinor: 350, stock: 30 },
  { scientificName: 'Schizachyrium scoparium', collected: 'wild-collected, Quillby Ridge, fall 2026', seedsPerPacket: 250, priceMinor: 300, stock: 35 },
] as const

export async function loadDemoSale(tx: Tx) {
  const { seedSales, pickupEvents, seedLots } = await import('../database/schema')
  const { speciesKey } = await import('#shared/utils/seed-plan')
  const day = (offset: number) => new Date(Date.now() + offset * 86_400_000).toISOString().slice(0, 10)
  const saleId = insertedId(await tx.insert(seedSales).values({ name: `${DEMO_ORGANISATION} seed sale`, opensOn: day(-10), closesOn: day(60), currency: 'usd', mailEnabled: true, mailFeeMinor: 500 }).$returningId())
  await tx.insert(pickupEvents).values([
    { saleId, startsAt: `${day(21)} 10:00:00`, place: `${DEMO_TOWN} library porch, 12 Quarry Row` },
    { saleId, startsAt: `${day(35)} 14:00:00`, place: 'Millrace community garden shed' },
  ])
  await tx.insert(seedLots).values(DEMO_SALE_LOTS.map((l) => ({ ...l, saleId, speciesKey: speciesKey(l.scientificName) })))
}
