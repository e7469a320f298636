// The one matching rule for species names, used by the catalogue's lookups, search and sort alike (server and
// browser): a key for finding a species by name, a fold for searching, and a collator for sorting.

/**
 * The key every name lookup uses: lower case, one space, a quoted cultivar dropped, the hybrid sign (× or a
 * spaced x) glued to the epithet as `×`. `Abelia X grandiflora 'Edward Goucher'` → `abelia ×grandiflora`.
 */
export function nameKey(name: string): string {
  return name.replace(/'[^']*'|"[^"]*"|‘[^’]*’/g, ' ').replace(/\s+[x×]\s+/gi, ' ×').replace(/\s+/g, ' ').trim().toLowerCase()
}

/**
 * A name or a search term folded for matching: Unicode NFD with the accents dropped, lower case, the hybrid
 * sign read as the letter x and set apart as a word, one space. `Gaspé` → `gaspe`; `Acer ×freemanii` and
 * `Acer x freemanii` → `acer x freemanii`.
 */
export function foldName(text: string): string {
  return text.normalize('NFD').replace(/\p{M}/gu, '').toLowerCase().replace(/\s*×\s*/g, ' x ').replace(/\s+/g, ' ').trim()
}

/** How well a folded name matches a folded term: 4 the whole name, 3 its start, 2 a word's start, 1 inside a word, 0 not. */
export function matchQuality(name: string, term: string): number {
  if (!term) return 0
  const at = name.indexOf(term)
  if (at < 0) return 0
  if (at === 0) return name.length === term.length ? 4 : 3
  for (let i = at; i >= 0; i = name.indexOf(term, i + 1)) if (/[\s\-/(]/.test(name[i - 1]!)) return 2
  return 1
}

/** Sort order for names shown to people: letters before case and accents, numbers by value. */
export const NAME_COLLATOR = new Intl.Collator('en-US', { sensitivity: 'base', numeric: true })
export const compareNames = (a: string, b: string) => NAME_COLLATOR.compare(a, b)
