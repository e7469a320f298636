// The Drizzle schema: one file per domain, all re-exported here (drizzle.config.ts and server/utils/db.ts read this).
export * from './accounts'
export * from './yards'
export * from './settings'
export * from './jobs'
export * from './advice'
export * from './drives'
export * from './catalogue'
export * from './seed'
