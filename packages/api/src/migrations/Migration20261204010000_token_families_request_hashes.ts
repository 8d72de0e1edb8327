import { Migration } from '@mikro-orm/migrations';

/**
 * Refresh tokens get the family they rotate within: a token shown twice (copied, or sent twice at once)
 * ends its family. Tokens issued before this migration are put into one family per user, which keeps
 * what a reused old token did then (end all of that user's sessions).
 *
 * Fits get the SHA-256 of the submit body they were made from, so that the same Idempotency-Key with
 * another body is refused instead of answered with the first fit. Fits submitted before stay without it.
 */
export class Migration20261204010000 extends Migration {
  override async up(): Promise<void> {
    this.addSql('alter table `refresh_tokens` add `family_id` varchar(36) null;');
    this.addSql('update `refresh_tokens` set `family_id` = `user_id`;');
    this.addSql('alter table `refresh_tokens` modify `family_id` varchar(36) not null;');
    this.addSql('alter table `refresh_tokens` add index `refresh_tokens_family_id_index`(`family_id`);');
    this.addSql('alter table `fit_runs` add `request_sha256` varchar(64) null;');
  }

  override async down(): Promise<void> {
    this.addSql('alter table `fit_runs` drop column `request_sha256`;');
    this.addSql('alter table `refresh_tokens` drop index `refresh_tokens_family_id_index`;');
    this.addSql('alter table `refresh_tokens` drop column `family_id`;');
  }
}
