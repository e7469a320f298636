// The yards a person may open, as two index lookups (owned by them; shared with them) joined by UNION ALL, so
// the list never reads the whole yards table. Explicit imports only: tests EXPLAIN this very query.
import { eq, sql, type SQL } from 'drizzle-orm'
import { unionAll } from 'drizzle-orm/mysql-core'
import type { MySql2Database } from 'drizzle-orm/mysql2'
import { yards, yardMembers, users } from '../database/schema'

const listColumns = (memberRole: SQL.Aliased<string | null>) => ({
  id: yards.id, name: yards.name, region: yards.region, zone: yards.zone, units: yards.units, version: yards.version,
  ownerId: yards.ownerId, ownerName: users.name, updatedAt: yards.updatedAt, createdAt: yards.createdAt,
  memberRole,
  plantings: sql<number>`coalesce(json_length(${yards.document}, '$.plantings'), 0)`.as('plantings'),
})

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export function yardListQuery(db: MySql2Database<any>, userId: number) {
  const owned = db.select(listColumns(sql<string | null>`null`.as('member_role'))).from(yards)
    .innerJoin(users, eq(users.id, yards.ownerId))
    .where(eq(yards.ownerId, userId))
  const shared = db.select(listColumns(sql<string | null>`${yardMembers.role}`.as('member_role'))).from(yardMembers)
    .innerJoin(yards, eq(yards.id, yardMembers.yardId))
    .innerJoin(users, eq(users.id, yards.ownerId))
    .where(eq(yardMembers.userId, userId))
  return unionAll(owned, shared)
}
