import { Migrator } from '@mikro-orm/migrations';
import { defineConfig, MariaDbDriver, type Options } from '@mikro-orm/mariadb';
import path from 'node:path';
import type { AppConfig } from '../config/app-config';
import { migrationsList } from '../migrations';
import { ENTITIES } from './entities';

export function ormOptions(config: AppConfig): Options {
  return defineConfig({
    driver: MariaDbDriver,
    host: config.db.host,
    port: config.db.port,
    dbName: config.db.name,
    user: config.db.user,
    password: config.db.password,
    entities: ENTITIES,
    extensions: [Migrator],
    // Dates stay in UTC end to end; the server's own time zone must not shift stored instants.
    timezone: '+00:00',
    forceUtcTimezone: true,
    debug: false,
    allowGlobalContext: false,
    migrations: {
      migrationsList,
      // Used only by `mikro-orm migration:create` when run from a build (see migrations/index.ts).
      path: path.resolve(__dirname, '../migrations'),
      pathTs: path.resolve(__dirname, '../../src/migrations'),
      snapshot: true,
      // Callers report what was applied themselves (cli/migrate.ts); keeps test output clean.
      silent: true,
      snapshotName: '.snapshot-limbus',
      // MariaDB commits implicitly around DDL, so a wrapping transaction would only pretend.
      transactional: false,
      allOrNothing: false,
    },
  });
}
