import { Migration } from '@mikro-orm/migrations';

/**
 * A ring event may carry its dip's apparent opacity from the light curve (`{ value, sigma, lowerLimit }`),
 * so that a fit can give the ring's optical depths and equivalent widths there (docs/method.md, "Ring
 * dips"). Null for dips timed without their depth, as every one stored before.
 */
export class Migration20261204050000 extends Migration {
  override async up(): Promise<void> {
    this.addSql('alter table `ring_events` add `apparent_opacity` json null;');
  }

  override async down(): Promise<void> {
    this.addSql('alter table `ring_events` drop column `apparent_opacity`;');
  }
}
