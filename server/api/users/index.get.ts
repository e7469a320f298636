// Coordinators: list accounts, with a name/e-mail search and paging.
import { like, or, count, asc } from 'drizzle-orm'
import { usersQuery } from '#shared/schemas/auth'
import { users } from '../../database/schema'

const PAGE_SIZE = 50

export default defineEventHandler(async (event) => {
  const { q, page } = readQueryWith(event, usersQuery)
  await requireRole(event, 'coordinator')
  const pattern = q ? containsPattern(q) : ''
  const where = q ? or(like(users.email, pattern), like(users.name, pattern)) : undefined
  const db = useDb()
  const [items, [total]] = await Promise.all([
    db.select({ id: users.id, email: users.email, name: users.name, role: users.role, createdAt: users.createdAt })
      .from(users).where(where).orderBy(asc(users.name)).limit(PAGE_SIZE).offset((page - 1) * PAGE_SIZE),
    db.select({ n: count() }).from(users).where(where),
  ])
  return { items, total: total?.n ?? 0, page, pageSize: PAGE_SIZE }
})
