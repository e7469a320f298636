import type { Client } from '../../support/http'

export type Persona = 'anonymous' | 'owner' | 'otherHomeowner' | 'advisor' | 'coordinator'

export interface AccessContext {
  /** a yard owned by `owner`, shared with nobody and not pledged */
  yardId: number
  owner: Client
  /** a fresh yard of `owner`'s, for routes that change or delete it */
  freshYard(): Promise<number>
}

export interface AccessRow {
  /** the route file under server/api, e.g. 'yards/[id].put.ts', or under server/routes as 'routes/…' */
  file: string
  method: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE'
  /** the request to make as each persona (a fresh one per persona) */
  request(ctx: AccessContext, persona: Persona): Promise<{ path: string; body?: unknown }> | { path: string; body?: unknown }
  expect: Record<Persona, number>
}
