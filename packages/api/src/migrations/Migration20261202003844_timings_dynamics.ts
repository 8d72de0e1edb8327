import { Migration } from '@mikro-orm/migrations';

export class Migration20261202003844 extends Migration {
  override async up(): Promise<void> {
    this.addSql(
      `create table \`light_curve_timings\` (\`id\` varchar(36) not null, \`event_id\` varchar(36) not null, \`report_id\` varchar(36) not null, \`created_by_id\` varchar(36) null, \`upload_sha256\` varchar(64) not null, \`options\` json not null, \`state\` varchar(16) not null, \`error\` text null, \`result\` json null, \`accepted_at\` datetime null, \`ring_events_created_at\` datetime null, \`created_at\` datetime not null, \`finished_at\` datetime null, primary key (\`id\`)) default character set utf8mb4 engine = InnoDB;`,
    );
    this.addSql(
      `alter table \`light_curve_timings\` add index \`light_curve_timings_event_id_index\`(\`event_id\`);`,
    );
    this.addSql(
      `alter table \`light_curve_timings\` add index \`light_curve_timings_report_id_index\`(\`report_id\`);`,
    );
    this.addSql(
      `alter table \`light_curve_timings\` add index \`light_curve_timings_created_by_id_index\`(\`created_by_id\`);`,
    );
    this.addSql(
      `alter table \`light_curve_timings\` add index \`light_curve_timings_report_id_created_at_index\`(\`report_id\`, \`created_at\`);`,
    );

    this.addSql(
      `create table \`dynamics_contexts\` (\`id\` varchar(36) not null, \`event_id\` varchar(36) not null, \`document\` json not null, \`updated_by_id\` varchar(36) null, \`created_at\` datetime not null, \`updated_at\` datetime not null, primary key (\`id\`)) default character set utf8mb4 engine = InnoDB;`,
    );
    this.addSql(
      `alter table \`dynamics_contexts\` add index \`dynamics_contexts_event_id_index\`(\`event_id\`);`,
    );
    this.addSql(
      `alter table \`dynamics_contexts\` add unique \`dynamics_contexts_event_id_unique\`(\`event_id\`);`,
    );
    this.addSql(
      `alter table \`dynamics_contexts\` add index \`dynamics_contexts_updated_by_id_index\`(\`updated_by_id\`);`,
    );

    this.addSql(
      `alter table \`light_curve_timings\` add constraint \`light_curve_timings_event_id_foreign\` foreign key (\`event_id\`) references \`events\` (\`id\`) on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table \`light_curve_timings\` add constraint \`light_curve_timings_report_id_foreign\` foreign key (\`report_id\`) references \`reports\` (\`id\`) on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table \`light_curve_timings\` add constraint \`light_curve_timings_created_by_id_foreign\` foreign key (\`created_by_id\`) references \`users\` (\`id\`) on update cascade on delete set null;`,
    );

    this.addSql(
      `alter table \`dynamics_contexts\` add constraint \`dynamics_contexts_event_id_foreign\` foreign key (\`event_id\`) references \`events\` (\`id\`) on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table \`dynamics_contexts\` add constraint \`dynamics_contexts_updated_by_id_foreign\` foreign key (\`updated_by_id\`) references \`users\` (\`id\`) on update cascade on delete set null;`,
    );
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists \`light_curve_timings\`;`);

    this.addSql(`drop table if exists \`dynamics_contexts\`;`);
  }
}
