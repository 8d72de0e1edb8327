import { Migration } from '@mikro-orm/migrations';

export class Migration20261202004801 extends Migration {
  override async up(): Promise<void> {
    this.addSql(`alter table \`fit_runs\` modify \`created_at\` datetime(3) not null;`);

    this.addSql(`alter table \`reviews\` modify \`created_at\` datetime(3) not null;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table \`reviews\` modify \`created_at\` datetime not null;`);

    this.addSql(`alter table \`fit_runs\` modify \`created_at\` datetime not null;`);
  }
}
