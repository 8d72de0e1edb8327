import { Migration } from '@mikro-orm/migrations';

/**
 * Planning an event before it happens: the event's prediction settings (the event file's `prediction`
 * section) and where its offset came from, and each station's status with the notes of a proposed site.
 * Existing stations are the ones observed, so they become `observing`, the column's default.
 */
export class Migration20261204000000 extends Migration {
  override async up(): Promise<void> {
    this.addSql(`alter table \`events\` add \`prediction\` json null, add \`prediction_source\` json null;`);
    this.addSql(
      `alter table \`stations\` add \`status\` varchar(16) not null default 'observing', add \`notes\` text null;`,
    );
    this.addSql(
      `alter table \`stations\` add constraint \`stations_status_check\` check (\`status\` in ('observing', 'planned', 'proposed'));`,
    );
  }

  override async down(): Promise<void> {
    this.addSql(`alter table \`stations\` drop constraint \`stations_status_check\`;`);
    this.addSql(`alter table \`stations\` drop column \`status\`, drop column \`notes\`;`);
    this.addSql(`alter table \`events\` drop column \`prediction\`, drop column \`prediction_source\`;`);
  }
}
