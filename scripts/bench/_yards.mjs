// Bench yards drawn as people draw them: a lawn over most of the lot with a house, a drive and paths on it, beds
// on the lawn (some L-shaped, some curved, some overlapping), drifts in beds and on the lawn, and plants spread
// over the whole lot — trees near the lot line hang across it, ground plants stand on the lawn and in beds.
// Seeded, so every run scores the same yards.
const rect = (x, y, w, h) => [[x, y], [x + w, y], [x + w, y + h], [x, y + h]]
const round = (v) => Math.round(v * 1000) / 1000

function random(seed) {
  let s = seed >>> 0
  return () => { s = (s + 0x6d2b79f5) >>> 0; let t = s; t = Math.imul(t ^ (t >>> 15), t | 1); t ^= t + Math.imul(t ^ (t >>> 7), t | 61); return ((t ^ (t >>> 14)) >>> 0) / 4294967296 }
}

const TREES = ['Quercus alba', 'Acer platanoides', 'Acer rubrum']
const SHRUBS = ['Cornus sericea', 'Berberis thunbergii', 'Viburnum dentatum', 'Euonymus alatus']
const GROUND = ['Echinacea purpurea', 'Asclepias tuberosa', 'Carex pensylvanica', 'Rudbeckia hirta', 'Hosta plantaginea', null]

/** A yard of `plantings` plantings and `areas` areas on a `width` × `depth` m lot. */
export function realisticYard({ width, depth, plantings, areas, seed = 7 }) {
  const rnd = random(seed)
  const at = (lo, hi) => lo + rnd() * (hi - lo)
  const list = []
  const shapes = [
    { id: 'house', kind: 'building', z: 10, points: rect(width * 0.3, depth * 0.35, width * 0.4, depth * 0.2) },
    { id: 'drive', kind: 'paving', z: 9, points: rect(width - 5, depth * 0.45, 4, depth * 0.55) },
    { id: 'path', kind: 'paving', z: 9, points: [[width * 0.45, depth * 0.55], [width * 0.5, depth * 0.55], [width * 0.55, depth], [width * 0.5, depth]] },
  ]
  const beds = []
  for (let i = 0; shapes.length < areas; i++) {
    const w = at(2, 6), h = at(1.5, 4)
    const x = at(-1, width - w + 1), y = at(-1, depth - h + 1)
    let points
    if (i % 5 === 1) points = [[x, y], [x + w, y], [x + w, y + h / 2], [x + w / 2, y + h / 2], [x + w / 2, y + h], [x, y + h]]
    else if (i % 5 === 3) points = Array.from({ length: 16 }, (_, k) => [x + w / 2 + (w / 2) * Math.cos((k / 16) * 2 * Math.PI), y + h / 2 + (h / 2) * Math.sin((k / 16) * 2 * Math.PI)])
    else points = rect(x, y, w, h)
    points = points.map(([a, b]) => [round(a), round(b)])
    beds.push(points)
    shapes.push({ id: `bed${i}`, kind: i % 17 === 0 ? 'water' : 'bed', z: 4 + (i % 3), points })
  }
  list.push({ id: 'lawn', species: 'Poa pratensis', z: 0, points: [[0.5, 0.5], [width - 0.5, 0.5], [width - 0.5, depth * 0.6], [width * 0.7, depth - 0.5], [0.5, depth - 0.5]].map(([a, b]) => [round(a), round(b)]), spacing: null, height: 0.08 })
  for (let i = 1; list.length < plantings; i++) {
    const kind = i % 20
    if (kind === 0 && beds.length) {
      // a drift in a bed (a piece of it), or on the open lawn
      const bed = beds[i % beds.length]
      const [x0, y0] = bed[0]
      const onLawn = i % 40 === 0
      const x = onLawn ? at(1, width - 5) : x0 + 0.2
      const y = onLawn ? at(1, depth - 4) : y0 + 0.2
      list.push({ id: `drift${i}`, species: GROUND[i % 5], z: onLawn ? 3 : 7, points: rect(round(x), round(y), 1.5, 1.2), spacing: 0.4, height: 0.5 })
    } else if (kind === 1 || kind === 11) {
      // trees anywhere, near the lot line too, so their crowns cross it
      list.push({ id: `t${i}`, species: TREES[i % TREES.length], x: round(at(-1, width + 1)), y: round(at(-1, depth + 1)), count: 1, spread: round(at(5, 12)), height: round(at(8, 20)) })
    } else if (kind < 7) {
      list.push({ id: `s${i}`, species: SHRUBS[i % SHRUBS.length], x: round(at(0, width)), y: round(at(0, depth)), count: 1 + (i % 3), spread: round(at(0.8, 2.5)) })
    } else {
      list.push({ id: `g${i}`, species: GROUND[i % GROUND.length], cultivar: i % 13 === 0 ? 'Evening Glow' : null, x: round(at(0, width)), y: round(at(0, depth)), count: 1 + (i % 5), spread: round(at(0.3, 0.8)) })
    }
  }
  return { format: 'wildward.yard/1', region: 'US-OH', units: 'ft', boundary: rect(0, 0, width, depth), areas: shapes, plantings: list }
}

export const SMALL_YARD = { width: 18, depth: 36, plantings: 150, areas: 14 }
export const LARGE_YARD = { width: 60, depth: 90, plantings: 1000, areas: 100 }
