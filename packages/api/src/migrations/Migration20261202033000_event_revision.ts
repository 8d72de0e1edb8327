import { Migration } from '@mikro-orm/migrations';

/** The tables whose rows make up an event's detail view, each with a column naming its event. */
const CHILD_TABLES = ['stations', 'chords', 'ring_events'] as const;

/**
 * `events.revision` rises with every write to an event or to its stations, chords and ring events.
 * Triggers keep it, so it holds whoever writes (any service, a native delete, another process, an
 * operator at the SQL prompt); the API's detail cache is only as good as this number.
 */
export class Migration20261202033000 extends Migration {
  override async up(): Promise<void> {
    this.addSql(`alter table \`events\` add \`revision\` int unsigned not null default 0;`);
    this.addSql(
      `create trigger \`events_revision_on_update\` before update on \`events\` for each row set new.\`revision\` = old.\`revision\` + 1;`,
    );
    for (const table of CHILD_TABLES) {
      for (const [when, row] of [
        ['insert', 'new'],
        ['update', 'new'],
        ['delete', 'old'],
      ] as const) {
        this.addSql(
          `create trigger \`${table}_revision_on_${when}\` after ${when} on \`${table}\` for each row ` +
            `update \`events\` set \`revision\` = \`revision\` + 1 where \`id\` = ${row}.\`event_id\`;`,
        );
      }
    }
  }

  override async down(): Promise<void> {
    for (const table of CHILD_TABLES) {
      for (const when of ['insert', 'update', 'delete'])
        this.addSql(`drop trigger if exists \`${table}_revision_on_${when}\`;`);
    }
    this.addSql(`drop trigger if exists \`events_revision_on_update\`;`);
    this.addSql(`alter table \`events\` drop column \`revision\`;`);
  }
}
