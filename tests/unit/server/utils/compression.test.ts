// Choosing a content coding from Accept-Encoding (RFC 9110 §12.5.3: q=0 means "not acceptable", "*" matches
// any coding not listed) and which media types are worth compressing.
import { describe, it, expect } from 'vitest'
import { chooseEncoding, isCompressible } from '../../../../server/utils/compression'

describe('chooseEncoding', () => {
  it('prefers brotli when both are offered, as browsers send them (RFC 9110 §12.5.3)', () => {
    expect(chooseEncoding('gzip, deflate, br, zstd')).toBe('br')
  })
  it('takes gzip when brotli is not offered or refused with q=0', () => {
    expect(chooseEncoding('gzip, deflate')).toBe('gzip')
    expect(chooseEncoding('br;q=0, gzip;q=0.5')).toBe('gzip')
  })
  it('reads "*" as any coding not listed, and nothing or identity as no compression', () => {
    expect(chooseEncoding('*')).toBe('br')
    expect(chooseEncoding('br;q=0, *')).toBe('gzip')
    expect(chooseEncoding('')).toBeNull()
    expect(chooseEncoding('identity')).toBeNull()
    expect(chooseEncoding('gzip;q=0, br;q=0')).toBeNull()
  })
})

describe('isCompressible', () => {
  it('compresses text, JSON, JavaScript, SVG and the manifest; not images or fonts that are compressed already', () => {
    for (const t of ['text/html;charset=utf-8', 'application/json', 'text/css', 'application/javascript', 'image/svg+xml', 'application/manifest+json', 'text/calendar; charset=utf-8']) expect(isCompressible(t), t).toBe(true)
    for (const t of ['image/png', 'image/jpeg', 'font/woff2', 'application/pdf', 'application/octet-stream', '']) expect(isCompressible(t), t).toBe(false)
  })
})
