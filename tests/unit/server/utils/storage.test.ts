import { describe, it, expect } from 'vitest'
import { sniffImageType, MAX_IMAGE_BYTES } from '../../../../server/utils/storage'

// Signatures: PNG from the PNG spec (ISO/IEC 15948, section 5.2); JPEG SOI marker FF D8 followed by a marker FF
// (ITU-T T.81); WebP is a RIFF file whose form type is "WEBP" (RFC 9649, section 2.5).
describe('sniffImageType', () => {
  it('knows PNG, JPEG and WebP by their first bytes', () => {
    expect(sniffImageType(Uint8Array.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0]))).toBe('image/png')
    expect(sniffImageType(Uint8Array.from([0xff, 0xd8, 0xff, 0xdb]))).toBe('image/jpeg')
    expect(sniffImageType(Uint8Array.from([0x52, 0x49, 0x46, 0x46, 1, 2, 3, 4, 0x57, 0x45, 0x42, 0x50]))).toBe('image/webp')
  })
  it('refuses lookalikes and other files', () => {
    // a RIFF that is a WAVE file, a truncated PNG signature, a GIF, text
    expect(sniffImageType(Uint8Array.from([0x52, 0x49, 0x46, 0x46, 1, 2, 3, 4, 0x57, 0x41, 0x56, 0x45]))).toBeNull()
    expect(sniffImageType(Uint8Array.from([0x89, 0x50, 0x4e, 0x47]))).toBeNull()
    expect(sniffImageType(new TextEncoder().encode('GIF89a'))).toBeNull()
    expect(sniffImageType(new TextEncoder().encode('hello.png'))).toBeNull()
    expect(sniffImageType(new Uint8Array())).toBeNull()
  })
  it('has a 10 MB limit (10 × 1024 × 1024 bytes)', () => {
    expect(MAX_IMAGE_BYTES).toBe(10_485_760)
  })
})
