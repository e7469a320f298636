// Which answers are worth compressing, and which encoding a browser takes (pure, unit-tested).

/** Below this an answer goes as it is: the headers and the compressor's framing would eat the saving. */
export const COMPRESS_MIN_BYTES = 1024

const COMPRESSIBLE = /^(text\/|application\/(json|javascript|xml|manifest\+json|ld\+json)|image\/svg\+xml)/i

export function isCompressible(contentType: string): boolean {
  return COMPRESSIBLE.test(contentType.trim())
}

/** 'br' or 'gzip' from an Accept-Encoding header (q=0 refuses one), brotli first; null for neither. */
export function chooseEncoding(acceptEncoding: string): 'br' | 'gzip' | null {
  const accepted = new Map<string, number>()
  for (const part of acceptEncoding.toLowerCase().split(',')) {
    const [name, ...params] = part.trim().split(';')
    if (!name) continue
    const q = params.map((p) => p.trim()).find((p) => p.startsWith('q='))
    accepted.set(name.trim(), q ? Number(q.slice(2)) : 1)
  }
  const ok = (name: string) => (accepted.get(name) ?? accepted.get('*') ?? 0) > 0
  if (ok('br')) return 'br'
  if (ok('gzip')) return 'gzip'
  return null
}
