import { Migration } from '@mikro-orm/migrations';

/**
 * One open report per observer and station, kept by MariaDB: `reports.open_author_id` holds the author
 * while the report is submitted or accepted and is null once it is rejected, and the unique key
 * (station, open_author_id) refuses a second open one whatever the timing (NULLs never clash).
 *
 * Reports submitted at the same moment before this rule may have left several open ones. Of those the
 * accepted one (else the newest) takes the key; the others keep their state and stay without it, so a
 * coordinator rejects them, and accepting one answers 409 while the kept one is open.
 */
export class Migration20261204020000 extends Migration {
  override async up(): Promise<void> {
    this.addSql('alter table `reports` add `open_author_id` varchar(36) null;');
    this.addSql(
      'update `reports` r join (' +
        'select `id` from (select `id`, row_number() over (partition by `station_id`, `author_id` ' +
        "order by `state` = 'accepted' desc, `created_at` desc, `id` desc) as k " +
        "from `reports` where `state` in ('submitted', 'accepted')) ranked where k = 1" +
        ') kept on kept.`id` = r.`id` set r.`open_author_id` = r.`author_id`;',
    );
    this.addSql(
      'alter table `reports` add unique `reports_station_id_open_author_id_unique`(`station_id`, `open_author_id`);',
    );
  }

  override async down(): Promise<void> {
    this.addSql('alter table `reports` drop index `reports_station_id_open_author_id_unique`;');
    this.addSql('alter table `reports` drop column `open_author_id`;');
  }
}
