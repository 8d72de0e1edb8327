import { Migration } from '@mikro-orm/migrations';

/** χ² maps of solved fits (chi2-maps/entities/chi2-map-run.entity.ts), deleted with their fit. */
export class Migration20261204040000 extends Migration {
  override async up(): Promise<void> {
    this.addSql(
      `create table \`chi2_maps\` (\`id\` varchar(36) not null, \`fit_id\` varchar(36) not null, \`created_by_id\` varchar(36) null, \`request\` json not null, \`state\` varchar(16) not null, \`progress\` int not null, \`error\` text null, \`result\` json null, \`created_at\` datetime(3) not null, \`started_at\` datetime null, \`finished_at\` datetime null, primary key (\`id\`)) default character set utf8mb4 engine = InnoDB;`,
    );
    this.addSql(`alter table \`chi2_maps\` add index \`chi2_maps_fit_id_index\`(\`fit_id\`);`);
    this.addSql(`alter table \`chi2_maps\` add index \`chi2_maps_created_by_id_index\`(\`created_by_id\`);`);
    this.addSql(
      `alter table \`chi2_maps\` add index \`chi2_maps_fit_id_created_at_index\`(\`fit_id\`, \`created_at\`);`,
    );
    this.addSql(
      `alter table \`chi2_maps\` add constraint \`chi2_maps_fit_id_foreign\` foreign key (\`fit_id\`) references \`fit_runs\` (\`id\`) on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table \`chi2_maps\` add constraint \`chi2_maps_created_by_id_foreign\` foreign key (\`created_by_id\`) references \`users\` (\`id\`) on update cascade on delete set null;`,
    );
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists \`chi2_maps\`;`);
  }
}
