/**
 * The database schema: the source of truth for tables, one file per area. Migrations in drizzle/ are generated
 * from the tables exported here with `npm run db:generate` and committed; never edit a generated migration by
 * hand. Area files import each other's tables directly (never this index), so no module waits on itself.
 */
export * from './schema-core';
export * from './schema-sculpts';
export * from './schema-bench';
export * from './schema-sharing';
export * from './schema-packs';
