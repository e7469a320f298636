// Every string a schema accepts fits the column it is stored in, so the database never refuses what the
// form and the route allowed (a 500 where a 400 belongs).
import { describe, it, expect } from 'vitest'
import type { z } from 'zod'
import * as db from '../../../../server/database/schema'
import { registerBody, loginBody } from '#shared/schemas/auth'
import { createYardBody } from '#shared/schemas/yard'
import { adviceRequestBody, closeRequestBody, visitBody, visitUpdateBody, pinBody, declineBody, inviteBody } from '#shared/schemas/advice'
import { driveBody, pledgeBody, mailingBody } from '#shared/schemas/drives'
import { seedPriceBody } from '#shared/schemas/seed'
import { RECOMMENDATION_SUMMARY_MAX } from '#shared/utils/recommendations'

type Column = { getSQLType(): string; length?: number; name: string }

/** The largest length a zod string schema accepts (through optional, default, nullable), or Infinity. */
function maxLength(schema: z.ZodType): number {
  let s = schema as unknown as { _zod: { def: { type: string; innerType?: unknown; in?: unknown; checks?: Array<{ _zod: { def: { check: string; maximum?: number } } }> } } }
  for (let i = 0; i < 10 && s._zod.def.type !== 'string'; i++) s = (s._zod.def.innerType ?? s._zod.def.in) as typeof s
  const limits = (s._zod.def.checks ?? []).filter((c) => c._zod.def.check === 'max_length').map((c) => c._zod.def.maximum!)
  return Math.min(Infinity, ...limits)
}

/** How many characters a column holds: varchar(n) counts characters; TEXT holds 65,535 bytes, 4 per utf8mb4 character at worst. */
function capacity(column: Column): number {
  const type = column.getSQLType()
  const varchar = /^(var)?char\((\d+)\)$/.exec(type)
  if (varchar) return Number(varchar[2])
  if (type === 'text') return Math.floor(65_535 / 4)
  if (type === 'mediumtext' || type === 'longtext' || type === 'json') return Infinity
  throw new Error(`no capacity rule for ${type}`)
}

// schema field → the column it is stored in (MariaDB strict mode refuses a longer value)
const PAIRS: Array<[string, z.ZodType, Column]> = [
  ['registerBody.email', registerBody.shape.email, db.users.email],
  ['registerBody.name', registerBody.shape.name, db.users.name],
  ['loginBody.email', loginBody.shape.email, db.users.email],
  ['createYardBody.name', createYardBody.shape.name, db.yards.name],
  ['adviceRequestBody.message', adviceRequestBody.shape.message, db.adviceRequests.message],
  ['adviceRequestBody.preferredTimes', adviceRequestBody.shape.preferredTimes, db.adviceRequests.preferredTimes],
  ['closeRequestBody.note', closeRequestBody.shape.note, db.adviceRequests.closingNote],
  ['visitBody.notes', visitBody.shape.notes, db.siteVisits.notes],
  ['visitUpdateBody.notes', visitUpdateBody.shape.notes, db.siteVisits.notes],
  ['pinBody.comment', pinBody.shape.comment, db.visitPins.comment],
  ['declineBody.reason', declineBody.shape.reason, db.recommendations.declineReason],
  ['inviteBody.email', inviteBody.shape.email, db.yardInvites.email],
  ['driveBody.name', (driveBody as unknown as { _zod: { def: { in: { shape: Record<string, z.ZodType> } } } })._zod.def.in?.shape?.name ?? (driveBody as unknown as { shape: Record<string, z.ZodType> }).shape.name, db.drives.name],
  ['pledgeBody.neighbourhood', pledgeBody.shape.neighbourhood, db.pledges.neighbourhood],
  ['mailingBody.subject', mailingBody.shape.subject, db.driveMailings.subject],
  ['seedPriceBody.scientificName', seedPriceBody.shape.scientificName, db.seedPrices.scientificName],
]

describe('schema string limits against their columns', () => {
  for (const [name, schema, column] of PAIRS) {
    it(`${name} fits ${column.name}`, () => {
      const max = maxLength(schema)
      expect(max, `${name} has no maximum`).toBeLessThan(Infinity)
      expect(max).toBeLessThanOrEqual(capacity(column))
    })
  }

  it('recommendation summaries are cut to their column', () => {
    expect(RECOMMENDATION_SUMMARY_MAX).toBe(capacity(db.recommendations.summary))
  })
})
