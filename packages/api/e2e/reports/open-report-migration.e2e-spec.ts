import { randomUUID } from 'node:crypto';
import { MikroORM } from '@mikro-orm/mariadb';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadConfig } from '../../src/config/app-config';
import { ormOptions } from '../../src/database/orm-options';

type Row = Record<string, unknown>;

const BEFORE = 'Migration20261204010000_token_families_request_hashes';
const THIS = 'Migration20261204020000_one_open_report';

/**
 * The open-report key on reports written before it, which simultaneous submits could leave with several
 * open reports of one observer at one station: a database of its own is brought to the previous
 * migration, filled through plain SQL, then migrated up to this one and down again.
 */
describe('Migration20261204020000_one_open_report', () => {
  const database = `limbus_migration_${randomUUID().slice(0, 8)}`;
  let admin: MikroORM;
  let orm: MikroORM;
  const sql = (statement: string, params: unknown[] = []) =>
    orm.em.getConnection().execute<Row[]>(statement, params);
  const ids = {
    team: randomUUID(),
    body: randomUUID(),
    user: randomUUID(),
    event: randomUUID(),
    station: randomUUID(),
    quiet: randomUUID(),
    older: randomUUID(),
    accepted: randomUUID(),
    newer: randomUUID(),
    rejected: randomUUID(),
    alone: randomUUID(),
  };

  beforeAll(async () => {
    const config = loadConfig({ LIMBUS_DEMO: '1', ...process.env });
    admin = await MikroORM.init(ormOptions(config));
    await admin.em
      .getConnection()
      .execute(`create database \`${database}\` character set utf8mb4 collate utf8mb4_unicode_ci`);
    orm = await MikroORM.init(ormOptions({ ...config, db: { ...config.db, name: database } }));
    await orm.getMigrator().up({ to: BEFORE });
    await sql("insert into `teams` (`id`, `name`, `created_at`) values (?, 'Team', utc_timestamp())", [
      ids.team,
    ]);
    await sql(
      'insert into `users` (`id`, `email`, `name`, `password_hash`, `is_admin`, `created_at`, `notice_opt_outs`) ' +
        "values (?, 'old@example.org', 'Old Observer', 'x', 0, utc_timestamp(), '[]')",
      [ids.user],
    );
    await sql(
      "insert into `bodies` (`id`, `team_id`, `name`, `created_at`, `updated_at`) values (?, ?, 'Quillon', utc_timestamp(), utc_timestamp())",
      [ids.body, ids.team],
    );
    await sql(
      'insert into `events` (`id`, `team_id`, `body_id`, `title`, `star`, `ephemeris`, `earth_rotation`, `fit_defaults`, ' +
        "`state`, `event_time_utc`, `created_at`, `updated_at`) values (?, ?, ?, 'Night', '{}', '{}', '{}', '{}', 'active', " +
        "'2028-03-14T02:14:00Z', utc_timestamp(), utc_timestamp())",
      [ids.event, ids.team, ids.body],
    );
    for (const station of [ids.station, ids.quiet])
      await sql(
        'insert into `stations` (`id`, `event_id`, `code`, `lat_deg`, `lon_deg`, `height_m`, `observer_id`, `position`) ' +
          'values (?, ?, ?, 0, 0, 0, ?, 0)',
        [station, ids.event, station.slice(0, 8), ids.user],
      );
    // Four reports of one observer at one station, as a race of submits left them, and one elsewhere.
    const report = (id: string, station: string, state: string, createdAt: string) =>
      sql(
        'insert into `reports` (`id`, `event_id`, `station_id`, `author_id`, `result`, `ring_dips`, `state`, `created_at`, `updated_at`) ' +
          "values (?, ?, ?, ?, 'clouded_out', '[]', ?, ?, ?)",
        [id, ids.event, station, ids.user, state, createdAt, createdAt],
      );
    await report(ids.older, ids.station, 'submitted', '2028-03-14 03:00:00');
    await report(ids.accepted, ids.station, 'accepted', '2028-03-14 03:00:01');
    await report(ids.newer, ids.station, 'submitted', '2028-03-14 03:00:02');
    await report(ids.rejected, ids.station, 'rejected', '2028-03-14 03:00:03');
    await report(ids.alone, ids.quiet, 'submitted', '2028-03-14 03:00:04');
    await orm.getMigrator().up({ to: THIS });
  }, 120_000);
  afterAll(async () => {
    await orm.close();
    await admin.em.getConnection().execute(`drop database \`${database}\``);
    await admin.close();
  });

  it('gives the key to the accepted report of a station (else the newest open one) and to no rejected one', async () => {
    const rows = await sql('select `id`, `state`, `open_author_id` from `reports`');
    const key = new Map(rows.map((r) => [r.id, r.open_author_id]));
    expect(key.get(ids.accepted)).toBe(ids.user);
    expect(key.get(ids.alone)).toBe(ids.user);
    for (const id of [ids.older, ids.newer, ids.rejected]) expect(key.get(id)).toBeNull();
    // The states are as they were: the coordinator decides the extra ones.
    expect(rows.filter((r) => r.state === 'submitted')).toHaveLength(3);
  });

  it('refuses a second open report of the observer at the station', async () => {
    await expect(
      sql('update `reports` set `open_author_id` = ? where `id` = ?', [ids.user, ids.newer]),
    ).rejects.toThrow(/Duplicate entry/);
  });

  it('goes down again without the column and its key', async () => {
    await orm.getMigrator().down();
    const columns = await sql("show columns from `reports` like 'open_author_id'");
    expect(columns).toHaveLength(0);
    await orm.getMigrator().up({ to: THIS });
  });
});
