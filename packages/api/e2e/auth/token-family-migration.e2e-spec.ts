import { randomUUID } from 'node:crypto';
import { MikroORM } from '@mikro-orm/mariadb';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadConfig } from '../../src/config/app-config';
import { ormOptions } from '../../src/database/orm-options';

type Row = Record<string, unknown>;

const BEFORE = 'Migration20261203182617_bodies_team_loop';
const THIS = 'Migration20261204010000_token_families_request_hashes';

/**
 * The token-family migration on refresh tokens written as the code before it wrote them (no family): a
 * database of its own is brought to the migration before, filled through plain SQL, migrated up and down.
 */
describe('Migration20261204010000_token_families_request_hashes', () => {
  const database = `limbus_migration_${randomUUID().slice(0, 8)}`;
  let admin: MikroORM;
  let orm: MikroORM;
  const sql = (statement: string, params: unknown[] = []) =>
    orm.em.getConnection().execute<Row[]>(statement, params);
  const users = [randomUUID(), randomUUID()];

  beforeAll(async () => {
    const config = loadConfig({ LIMBUS_DEMO: '1', ...process.env });
    admin = await MikroORM.init(ormOptions(config));
    await admin.em
      .getConnection()
      .execute(`create database \`${database}\` character set utf8mb4 collate utf8mb4_unicode_ci`);
    orm = await MikroORM.init(ormOptions({ ...config, db: { ...config.db, name: database } }));
    await orm.getMigrator().up({ to: BEFORE });
    for (const [i, id] of users.entries()) {
      await sql(
        "insert into `users` (`id`, `email`, `name`, `password_hash`, `is_admin`, `notice_opt_outs`, `created_at`) values (?, ?, 'Old User', 'x', 0, '[]', utc_timestamp())",
        [id, `old-${i}-${id.slice(0, 8)}@example.org`],
      );
      // A rotated (revoked) token and its live successor, as sign-in and one refresh left them.
      for (const revoked of [true, false]) {
        await sql(
          'insert into `refresh_tokens` (`id`, `user_id`, `token_hash`, `expires_at`, `revoked_at`, `created_at`) values (?, ?, ?, utc_timestamp() + interval 1 day, ?, utc_timestamp())',
          [randomUUID(), id, randomUUID().replace(/-/g, '').padEnd(64, '0'), revoked ? new Date() : null],
        );
      }
    }
    await orm.getMigrator().up({ to: THIS });
  }, 120_000);

  afterAll(async () => {
    await orm?.close();
    await admin?.em.getConnection().execute(`drop database if exists \`${database}\``);
    await admin?.close();
  });

  it("puts each user's earlier tokens into one family, so a reused old token still ends all of them", async () => {
    const rows = await sql('select `user_id`, `family_id` from `refresh_tokens`');
    expect(rows).toHaveLength(4);
    for (const row of rows) expect(row.family_id).toBe(row.user_id);
    const fitColumns = await sql("show columns from `fit_runs` like 'request_sha256'");
    expect(fitColumns.map((c) => [c.Field, c.Null])).toEqual([['request_sha256', 'YES']]);
  });

  it('goes down again to tokens and fits without those columns, and up again', async () => {
    await orm.getMigrator().down();
    expect(await sql("show columns from `refresh_tokens` like 'family_id'")).toEqual([]);
    expect(await sql("show columns from `fit_runs` like 'request_sha256'")).toEqual([]);
    await orm.getMigrator().up({ to: THIS });
    const families = await sql('select distinct `family_id` from `refresh_tokens`');
    expect(families.map((f) => String(f.family_id)).sort()).toEqual([...users].sort());
  });
});
