// `tsx scripts/generate-pledged-yards.ts [count]`: adds `count` (default 10,000) invented households, each with
// one yard pledged to the running drive (one is started when none runs), and a share snapshot at the pledge and
// one later. Names, neighbourhoods and yards are made up. DATABASE_URL names the database.
import mysql from 'mysql2/promise'
import { randomBytes } from 'node:crypto'

const COUNT = Number(process.argv[2] ?? 10_000)
const url = process.env.DATABASE_URL
if (!url) throw new Error('Set DATABASE_URL')
const NEIGHBOURHOODS = ['Alder Rise', 'Bramble End', 'Cobble Flats', 'Dunmere', 'Elderbank', 'Fallowfield', 'Gorse Hollow', 'Hazel Mews', 'Ivybridge Row', 'Juniper Vale',
  'Kestrel Park', 'Larkspur', 'Millrace', 'Nettlecombe', 'Oxlip Green', 'Pennywort', 'Quillfield', 'Rushmere', 'Sedgebrook', 'Teasel Court']
const FIRST = ['Ash', 'Bay', 'Cam', 'Dale', 'Eden', 'Fen', 'Gale', 'Hollis', 'Ira', 'Jory', 'Kit', 'Lee', 'Marlo', 'Nell', 'Oak', 'Perry', 'Quin', 'Rowan', 'Sage', 'Tam']
const LAST = ['Amberley', 'Bowdish', 'Cardew', 'Dimmock', 'Elvey', 'Furze', 'Gillow', 'Hatherly', 'Ibbot', 'Jessop', 'Kettering', 'Lusty', 'Mabbitt', 'Nuttall', 'Orchard', 'Pellow']

// deterministic invented variety (a linear congruential generator), so two runs make comparable data
let seed = 20240501
const rand = () => ((seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31)
const day = (offset: number) => new Date(Date.now() + offset * 86_400_000).toISOString().slice(0, 10)

/**
 * The shares of this template, worked out the way the score engine counts them: a W × D lot of turf lawn
 * (not native, 0.08 m tall, no plant count) with a native sedge drift of `drift` m² drawn over it (0.2 m tall,
 * 0.3 m on centre, so n = area / (0.866 s²) plants).
 */
function shares(lot: number, drift: number) {
  const lawn = lot - drift
  const plants = Math.ceil(drift / (0.866 * 0.3 * 0.3))
  const volNative = drift * 0.2
  const volTotal = volNative + lawn * 0.08
  return {
    count_native: plants, count_total: plants, count_share: plants > 0 ? 1 : 0,
    area_native: drift, area_total: lot, area_share: drift / lot,
    volume_native: volNative, volume_total: volTotal, volume_share: volTotal > 0 ? volNative / volTotal : 0,
    lawn_area: lawn,
  }
}

const rect = (w: number, h: number) => [[0, 0], [w, 0], [w, h], [0, h]]
function documentFor(name: string, w: number, d: number, driftDepth: number) {
  return {
    format: 'wildward.yard/1', name, region: 'US-OH', units: 'ft', boundary: rect(w, d), areas: [], lines: [],
    plantings: [
      { id: 'lawn', species: 'Poa pratensis', points: rect(w, d), z: 0, spacing: null, height: 0.08, label: 'Lawn' },
      ...(driftDepth > 0 ? [{ id: 'drift', species: 'Carex pensylvanica', points: rect(w, driftDepth), z: 1, spacing: 0.3, height: 0.2 }] : []),
    ],
  }
}

const pool = mysql.createPool({ uri: url, connectionLimit: 4, timezone: 'Z' })
const today = day(0)
let [[drive]] = await pool.query('SELECT id, goal FROM drives WHERE starts_on <= ? AND ends_on >= ? ORDER BY starts_on DESC, id DESC LIMIT 1', [today, today]) as unknown as [[{ id: number; goal: string } | undefined]]
if (!drive) {
  const [r] = await pool.query("INSERT INTO drives (name, starts_on, ends_on, goal, certifies, target) VALUES ('Generated drive', ?, ?, 0.7, 'area', 12000)", [day(-90), day(90)]) as unknown as [{ insertId: number }]
  drive = { id: r.insertId, goal: '0.7' }
}
const goal = Number(drive.goal)
const tag = randomBytes(4).toString('hex')
const CHUNK = 1000
const started = Date.now()
for (let from = 0; from < COUNT; from += CHUNK) {
  const n = Math.min(CHUNK, COUNT - from)
  const conn = await pool.getConnection()
  try {
    await conn.beginTransaction()
    const people = Array.from({ length: n }, (_, i) => {
      const k = from + i
      return [`generated-${tag}-${k}@example.invalid`, `${FIRST[k % FIRST.length]} ${LAST[Math.floor(rand() * LAST.length)]}`, '!generated-no-login']
    })
    const [u] = await conn.query('INSERT INTO users (email, name, password_hash) VALUES ?', [people]) as unknown as [{ insertId: number }]
    const yards = people.map((_, i) => {
      const w = 10 + Math.round(rand() * 20)
      const d = 15 + Math.round(rand() * 30)
      const target = rand() ** 0.8
      return { userId: u.insertId + i, w, d, before: Math.round(target * 0.4 * d * 10) / 10, after: Math.round(target * d * 10) / 10 }
    })
    const [y] = await conn.query('INSERT INTO yards (owner_id, name, region, units, document) VALUES ?', [yards.map((x, i) => [x.userId, `Generated yard ${from + i}`, 'US-OH', 'ft', JSON.stringify(documentFor(`Generated yard ${from + i}`, x.w, x.d, x.after))])]) as unknown as [{ insertId: number }]
    const pledgeRows: unknown[][] = []
    const snapshotRows: unknown[][] = []
    yards.forEach((x, i) => {
      const yardId = y.insertId + i
      const lot = x.w * x.d
      const base = shares(lot, x.before * x.w)
      const now = shares(lot, x.after * x.w)
      const pledgedAgo = 5 + Math.floor(rand() * 80)
      const status = now.area_share >= goal ? (rand() < 0.3 ? 'verified' : 'reached') : 'pledged'
      pledgeRows.push([drive!.id, yardId, x.userId, NEIGHBOURHOODS[Math.floor(rand() * NEIGHBOURHOODS.length)], rand() < 0.92 ? 1 : 0, status, day(-pledgedAgo),
        now.count_native, now.count_total, now.count_share, now.area_native, now.area_total, now.area_share, now.volume_native, now.volume_total, now.volume_share, now.lawn_area,
        base.area_native, base.lawn_area, base.area_share])
      snapshotRows.push([yardId, day(-pledgedAgo), ...Object.values(base)])
      snapshotRows.push([yardId, day(-Math.floor(pledgedAgo * rand())), ...Object.values(now)])
    })
    await conn.query(`INSERT INTO pledges (drive_id, yard_id, user_id, neighbourhood, consent, status, pledged_on,
      count_native, count_total, count_share, area_native, area_total, area_share, volume_native, volume_total, volume_share, lawn_area,
      base_area_native, base_lawn_area, base_share) VALUES ?`, [pledgeRows])
    await conn.query(`INSERT INTO share_snapshots (yard_id, day, count_native, count_total, count_share, area_native, area_total, area_share,
      volume_native, volume_total, volume_share, lawn_area) VALUES ? ON DUPLICATE KEY UPDATE area_share = VALUES(area_share)`, [snapshotRows])
    await conn.commit()
  } catch (e) {
    await conn.rollback()
    throw e
  } finally {
    conn.release()
  }
}
// the dashboard's cached summary of the drive is out of date now
await pool.query('INSERT INTO drive_summaries (drive_id, version) VALUES (?, 1) ON DUPLICATE KEY UPDATE version = version + 1', [drive.id])
console.log(`generated ${COUNT} pledged yards in drive ${drive.id} in ${((Date.now() - started) / 1000).toFixed(1)} s`)
await pool.end()
