import { mysqlTable, varchar, mysqlEnum, json, double, boolean, tinyint, char, index, uniqueIndex, primaryKey } from 'drizzle-orm/mysql-core'
import { id, ref, timestamps } from './columns'
import { users } from './accounts'
import { LAYERS, REGION_STATUSES } from '../../../shared/types/species'
import type { CatalogueEntry } from '../../../shared/utils/catalogue-rules'

// The species catalogue. catalogue_species and catalogue_regions hold the USDA base with the coordinator's
// overrides applied; the overrides themselves live in catalogue_overrides, so a catalogue reload re-applies them.

/** A species' full facts (in each instance's memory: the committed file with the overrides applied). */
export type CatalogueSpeciesData = Omit<CatalogueEntry, 'regions'> & { notes?: string | null }
/** The little the species table needs beyond its columns; full facts are not stored twice. */
export interface CatalogueRowData { estimated: string[]; spacing: number | null }

export const catalogueSpecies = mysqlTable('catalogue_species', {
  id: id(),
  // collation is case-insensitive, so the unique index also rules out names differing only in case
  scientificName: varchar('scientific_name', { length: 200 }).notNull(),
  commonName: varchar('common_name', { length: 200 }),
  layer: mysqlEnum('layer', LAYERS).notNull(),
  height: double('height_m').notNull(),
  spread: double('spread_m').notNull(),
  // comma lists of sun / moisture / soil, and bloom months, for filters and the table
  sun: varchar('sun', { length: 20 }).notNull().default(''),
  moisture: varchar('moisture', { length: 20 }).notNull().default(''),
  soil: varchar('soil', { length: 20 }).notNull().default(''),
  bloomMonths: varchar('bloom_months', { length: 40 }).notNull().default(''),
  minZone: char('min_zone', { length: 3 }),
  minZoneIndex: tinyint('min_zone_index'),
  toxic: boolean('toxic').notNull().default(false),
  hasFacts: boolean('has_facts').notNull().default(false),
  origin: mysqlEnum('origin', ['usda', 'coordinator']).notNull().default('usda'),
  data: json('data').$type<CatalogueRowData>().notNull(),
}, (t) => [
  uniqueIndex('catalogue_species_name_unique').on(t.scientificName),
  index('catalogue_species_common_idx').on(t.commonName),
  index('catalogue_species_layer_idx').on(t.layer, t.scientificName),
])

/** A species' status in one region; a region not listed is `absent`. */
export const catalogueRegions = mysqlTable('catalogue_regions', {
  region: varchar('region', { length: 6 }).notNull(),
  speciesId: ref('species_id').notNull().references(() => catalogueSpecies.id, { onDelete: 'cascade' }),
  status: mysqlEnum('status', REGION_STATUSES).notNull(),
  source: varchar('source', { length: 120 }).notNull(),
}, (t) => [
  primaryKey({ name: 'catalogue_regions_pk', columns: [t.region, t.speciesId] }),
  index('catalogue_regions_species_idx').on(t.speciesId),
  index('catalogue_regions_status_idx').on(t.region, t.status),
])

/**
 * The coordinator's corrections and regional lists, one row per (species, region, field); region '' means every
 * region (facts), a region code with field 'status' is a regional list entry. Names, not ids: ids change on reload.
 */
export const catalogueOverrides = mysqlTable('catalogue_overrides', {
  id: id(),
  scientificName: varchar('scientific_name', { length: 200 }).notNull(),
  region: varchar('region', { length: 6 }).notNull().default(''),
  field: varchar('field', { length: 40 }).notNull(),
  value: json('value').$type<unknown>(),
  source: varchar('source', { length: 120 }).notNull().default('coordinator'),
  createdBy: ref('created_by').references(() => users.id, { onDelete: 'set null' }),
  ...timestamps,
}, (t) => [
  uniqueIndex('catalogue_overrides_unique').on(t.scientificName, t.region, t.field),
  index('catalogue_overrides_region_idx').on(t.region),
])
