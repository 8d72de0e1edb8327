import type { MigrationObject } from '@mikro-orm/core';
import { Migration20261201235328 } from './Migration20261201235328_initial';
import { Migration20261202000927 } from './Migration20261202000927_event_workspace';
import { Migration20261202004801 } from './Migration20261202004801_times_in_ms';
import { Migration20261202003844 } from './Migration20261202003844_timings_dynamics';
import { Migration20261202033000 } from './Migration20261202033000_event_revision';
import { Migration20261203182617 } from './Migration20261203182617_bodies_team_loop';
import { Migration20261204000000 } from './Migration20261204000000_planning';
import { Migration20261204010000 } from './Migration20261204010000_token_families_request_hashes';
import { Migration20261204020000 } from './Migration20261204020000_one_open_report';
import { Migration20261204040000 } from './Migration20261204040000_chi2_maps';
import { Migration20261204050000 } from './Migration20261204050000_ring_event_opacity';

/**
 * Static list so the migrator works under vitest and from dist alike. To add one: build, run
 * `MIKRO_ORM_CLI_CONFIG=./dist/mikro-orm.config.js MIKRO_ORM_CLI_USE_TS_NODE=false pnpm exec mikro-orm migration:create`
 * (it writes the .ts into src/migrations and updates the snapshot), then append it below and commit both.
 */
export const migrationsList: MigrationObject[] = [
  { name: 'Migration20261201235328_initial', class: Migration20261201235328 },
  { name: 'Migration20261202000927_event_workspace', class: Migration20261202000927 },
  { name: 'Migration20261202003844_timings_dynamics', class: Migration20261202003844 },
  { name: 'Migration20261202004801_times_in_ms', class: Migration20261202004801 },
  { name: 'Migration20261202033000_event_revision', class: Migration20261202033000 },
  { name: 'Migration20261203182617_bodies_team_loop', class: Migration20261203182617 },
  { name: 'Migration20261204000000_planning', class: Migration20261204000000 },
  { name: 'Migration20261204010000_token_families_request_hashes', class: Migration20261204010000 },
  { name: 'Migration20261204020000_one_open_report', class: Migration20261204020000 },
  { name: 'Migration20261204040000_chi2_maps', class: Migration20261204040000 },
  { name: 'Migration20261204050000_ring_event_opacity', class: Migration20261204050000 },
];
