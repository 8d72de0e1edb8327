import { randomUUID } from 'node:crypto';
import { MikroORM } from '@mikro-orm/mariadb';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadConfig } from '../../src/config/app-config';
import { ormOptions } from '../../src/database/orm-options';
import { eventDataSha256 } from '../../src/events/event-data';
import { exampleEvent } from '../events/workspace';

type Row = Record<string, unknown>;

const BEFORE_BODIES = 'Migration20261202033000_event_revision';

const json = <T>(value: unknown): T => (typeof value === 'string' ? JSON.parse(value) : value) as T;

/**
 * The bodies migration on data written by the schema before it: a database of its own is brought to the
 * previous migration, filled through plain SQL as the old code wrote rows, then migrated up and down.
 */
describe('Migration20261203182617_bodies_team_loop', () => {
  const database = `limbus_migration_${randomUUID().slice(0, 8)}`;
  let admin: MikroORM;
  let orm: MikroORM;
  const sql = (statement: string, params: unknown[] = []) =>
    orm.em.getConnection().execute<Row[]>(statement, params);

  const ids = {
    teamA: randomUUID(),
    teamB: randomUUID(),
    user: randomUUID(),
    withChords: randomUUID(),
    withoutChords: randomUUID(),
    otherTeam: randomUUID(),
    station: randomUUID(),
    fit: randomUUID(),
  };
  const example = exampleEvent() as {
    star: unknown;
    ephemeris: { timeScale: string; rows: Array<{ time: string }> };
    earthRotation: unknown;
  };
  const olderContext = { format: 'limbus-context-input/1', note: 'older' };
  const newerContext = { format: 'limbus-context-input/1', note: 'newer' };

  beforeAll(async () => {
    const config = loadConfig({ LIMBUS_DEMO: '1', ...process.env });
    admin = await MikroORM.init(ormOptions(config));
    await admin.em
      .getConnection()
      .execute(`create database \`${database}\` character set utf8mb4 collate utf8mb4_unicode_ci`);
    orm = await MikroORM.init(ormOptions({ ...config, db: { ...config.db, name: database } }));
    await orm.getMigrator().up({ to: BEFORE_BODIES });

    await sql("insert into `teams` values (?, 'Team A', utc_timestamp()), (?, 'Team B', utc_timestamp())", [
      ids.teamA,
      ids.teamB,
    ]);
    await sql("insert into `users` values (?, 'old@example.org', 'Old User', 'x', 0, utc_timestamp())", [
      ids.user,
    ]);
    const event = (id: string, team: string, title: string) =>
      sql(
        "insert into `events` (`id`, `team_id`, `title`, `star`, `ephemeris`, `earth_rotation`, `fit_defaults`, `state`, `created_at`, `updated_at`) values (?, ?, ?, ?, ?, ?, '{}', 'active', utc_timestamp(), utc_timestamp())",
        [
          id,
          team,
          title,
          JSON.stringify(example.star),
          JSON.stringify(example.ephemeris),
          JSON.stringify(example.earthRotation),
        ],
      );
    await event(ids.withChords, ids.teamA, 'With chords');
    await event(ids.withoutChords, ids.teamA, 'Without chords');
    await event(ids.otherTeam, ids.teamB, 'Other team');
    await sql(
      "insert into `stations` values (?, ?, 'north', 10, 20, 0, null, null, null, null, null, null, 0)",
      [ids.station, ids.withChords],
    );
    await sql(
      "insert into `chords` (`id`, `event_id`, `station_id`, `type`, `disappearance`, `reappearance`, `source`, `created_at`, `updated_at`) values (?, ?, ?, 'positive', ?, ?, 'import', utc_timestamp(), utc_timestamp())",
      [
        randomUUID(),
        ids.withChords,
        ids.station,
        JSON.stringify({ time: '2028-03-14T02:10:07.5Z', sigmaSeconds: 0.1 }),
        JSON.stringify({ time: '2028-03-14T02:10:19.5Z', sigmaSeconds: 0.1 }),
      ],
    );
    await sql(
      "insert into `chords` (`id`, `event_id`, `station_id`, `type`, `start_utc`, `end_utc`, `source`, `created_at`, `updated_at`) values (?, ?, ?, 'negative', '2028-03-14T02:09:58.2Z', '2028-03-14T02:12:00Z', 'import', utc_timestamp(), utc_timestamp())",
      [randomUUID(), ids.withChords, ids.station],
    );
    await sql(
      "insert into `fit_runs` (`id`, `event_id`, `created_by_id`, `input`, `input_sha256`, `options`, `engine_version`, `seed`, `state`, `progress`, `attempts`, `review_state`, `created_at`) values (?, ?, ?, ?, 'x', '{}', 'old', 1, 'solved', 100, 1, 'approved', utc_timestamp())",
      [ids.fit, ids.withChords, ids.user, JSON.stringify(exampleEvent())],
    );
    // Two events of team A held their own, differing, physical parameters.
    await sql(
      'insert into `dynamics_contexts` values (?, ?, ?, null, utc_timestamp(), utc_timestamp() - interval 1 day), (?, ?, ?, ?, utc_timestamp(), utc_timestamp())',
      [
        randomUUID(),
        ids.withChords,
        JSON.stringify(olderContext),
        randomUUID(),
        ids.withoutChords,
        JSON.stringify(newerContext),
        ids.user,
      ],
    );
    // Two open invitations of one address (the old code allowed it) and an accepted one.
    const invitation = (email: string, role: string, hoursAgo: number, accepted: boolean) =>
      sql(
        'insert into `invitations` values (?, ?, ?, ?, ?, ?, utc_timestamp() + interval 1 day, ?, utc_timestamp() - interval ? hour)',
        [
          randomUUID(),
          ids.teamA,
          email,
          role,
          randomUUID().replace(/-/g, ''),
          ids.user,
          accepted ? new Date() : null,
          hoursAgo,
        ],
      );
    await invitation('twice@example.org', 'observer', 2, false);
    await invitation('twice@example.org', 'modeller', 1, false);
    await invitation('joined@example.org', 'reviewer', 3, true);

    // Up to this migration only, so that the down() below undoes this one and not a later one.
    await orm.getMigrator().up({ to: 'Migration20261203182617_bodies_team_loop' });
  }, 120_000);

  afterAll(async () => {
    await orm?.close();
    await admin?.em.getConnection().execute(`drop database if exists \`${database}\``);
    await admin?.close();
  });

  it('gives each team with events one "Unassigned" body holding them all', async () => {
    const bodies = await sql('select `id`, `team_id`, `name` from `bodies` order by `team_id`');
    expect(bodies.map((b) => [b.team_id, b.name]).sort()).toEqual(
      [
        [ids.teamA, 'Unassigned'],
        [ids.teamB, 'Unassigned'],
      ].sort(),
    );
    const events = await sql(
      'select e.`id`, e.`body_id`, b.`team_id` from `events` e join `bodies` b on b.`id` = e.`body_id`',
    );
    expect(events).toHaveLength(3);
    const teamOf = Object.fromEntries(events.map((e) => [e.id, e.team_id]));
    expect(teamOf).toEqual({
      [ids.withChords]: ids.teamA,
      [ids.withoutChords]: ids.teamA,
      [ids.otherTeam]: ids.teamB,
    });
  });

  it('dates each event by its earliest chord, else by the middle of its ephemeris', async () => {
    const rows = await sql('select `id`, `event_time_utc` from `events`');
    const time = Object.fromEntries(rows.map((r) => [r.id, r.event_time_utc]));
    // The negative's start (02:09:58.2) is earlier than the positive's disappearance (02:10:07.5).
    expect(time[ids.withChords]).toBe('2028-03-14T02:09:58Z');
    // The middle of the example's TDB table less TT − UTC = 69.184 s (32.184 s + 37 leap seconds, IERS
    // Bulletin C; from memory), to the second.
    const first = Date.parse(`${example.ephemeris.rows[0]?.time}Z`);
    const last = Date.parse(`${example.ephemeris.rows.at(-1)?.time}Z`);
    const middle = new Date(Math.floor(((first + last) / 2 - 69_184) / 1000) * 1000);
    expect(time[ids.withoutChords]).toBe(`${middle.toISOString().slice(0, 19)}Z`);
  });

  it("stores each fit's data hash from its own input", async () => {
    const [fit] = await sql('select `input`, `data_sha256` from `fit_runs` where `id` = ?', [ids.fit]);
    expect(fit?.data_sha256).toBe(eventDataSha256(json(fit?.input)));
  });

  it("keeps the newest physical parameters as the body's and the other, differing document in the audit log", async () => {
    const contexts = await sql('select `body_id`, `document` from `dynamics_contexts`');
    expect(contexts.map((c) => json<unknown>(c.document))).toEqual([newerContext]);
    const [superseded] = await sql(
      "select `team_id`, `event_id`, `detail` from `audit_entries` where `action` = 'dynamics.superseded'",
    );
    expect(superseded).toMatchObject({ team_id: ids.teamA, event_id: ids.withChords });
    expect(json<{ document: unknown }>(superseded?.detail).document).toEqual(olderContext);
  });

  it('turns each role into a one-role list and leaves one open invitation per address, the newer', async () => {
    const rows = await sql(
      'select `email`, `roles`, `open_email`, `revoked_at` from `invitations` order by `created_at`',
    );
    expect(
      rows.map((r) => [
        r.email,
        json<string[]>(r.roles),
        r.open_email,
        r.revoked_at === null ? 'open' : 'revoked',
      ]),
    ).toEqual([
      ['joined@example.org', ['reviewer'], null, 'open'],
      ['twice@example.org', ['observer'], null, 'revoked'],
      ['twice@example.org', ['modeller'], 'twice@example.org', 'open'],
    ]);
  });

  it('goes down again to one context per event and one role per invitation', async () => {
    await orm.getMigrator().down();
    const contexts = await sql('select `event_id`, `document` from `dynamics_contexts` order by `event_id`');
    // The body's document is copied to each of its events.
    expect(contexts.map((c) => c.event_id).sort()).toEqual([ids.withChords, ids.withoutChords].sort());
    expect(contexts.every((c) => json<{ note: string }>(c.document).note === 'newer')).toBe(true);
    const invitations = await sql('select `role` from `invitations` order by `created_at`');
    expect(invitations.map((r) => r.role)).toEqual(['reviewer', 'observer', 'modeller']);
    expect(await sql("show tables like 'bodies'")).toEqual([]);
    await orm.getMigrator().up();
    expect(Number((await sql('select count(*) as n from `bodies`'))[0]?.n)).toBe(2);
  });
});
