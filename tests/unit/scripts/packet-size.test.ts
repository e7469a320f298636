// A yard document at the body cap must fit in one statement under the packet size the start scripts give MariaDB.
import { describe, it, expect } from 'vitest'
import { MAX_ALLOWED_PACKET_BYTES } from '../../../scripts/lib/services.mjs'
import { MAX_DOCUMENT_BYTES } from '#shared/schemas/yard-document'

describe('document cap against max_allowed_packet', () => {
  it('leaves room for a whole document written once, with every character escaped', () => {
    // worst case: each byte of the JSON becomes two in the SQL text (a backslash before every quote or backslash)
    expect(2 * MAX_DOCUMENT_BYTES + 64 * 1024).toBeLessThanOrEqual(MAX_ALLOWED_PACKET_BYTES)
  })
})
