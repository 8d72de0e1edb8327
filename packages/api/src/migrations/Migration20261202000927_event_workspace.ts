import { Migration } from '@mikro-orm/migrations';

export class Migration20261202000927 extends Migration {
  override async up(): Promise<void> {
    this.addSql(
      `create table \`audit_entries\` (\`id\` varchar(36) not null, \`team_id\` varchar(36) not null, \`event_id\` varchar(36) null, \`actor_id\` varchar(36) null, \`action\` varchar(60) not null, \`object_type\` varchar(30) not null, \`object_id\` varchar(36) not null, \`detail\` json null, \`created_at\` datetime(3) not null, primary key (\`id\`)) default character set utf8mb4 engine = InnoDB;`,
    );
    this.addSql(
      `alter table \`audit_entries\` add index \`audit_entries_event_id_created_at_index\`(\`event_id\`, \`created_at\`);`,
    );

    this.addSql(
      `create table \`events\` (\`id\` varchar(36) not null, \`team_id\` varchar(36) not null, \`title\` varchar(300) not null, \`star\` json not null, \`ephemeris\` json not null, \`earth_rotation\` json not null, \`fit_defaults\` json not null, \`state\` varchar(16) not null, \`deleted_at\` datetime null, \`created_by_id\` varchar(36) null, \`created_at\` datetime not null, \`updated_at\` datetime not null, primary key (\`id\`)) default character set utf8mb4 engine = InnoDB;`,
    );
    this.addSql(`alter table \`events\` add index \`events_team_id_index\`(\`team_id\`);`);
    this.addSql(`alter table \`events\` add index \`events_team_id_state_index\`(\`team_id\`, \`state\`);`);

    this.addSql(
      `create table \`uploads\` (\`id\` varchar(36) not null, \`team_id\` varchar(36) not null, \`storage_key\` varchar(300) not null, \`name\` varchar(300) not null, \`content_type\` varchar(100) not null, \`size_bytes\` int not null, \`sha256\` varchar(64) not null, \`created_by_id\` varchar(36) null, \`created_at\` datetime not null, primary key (\`id\`)) default character set utf8mb4 engine = InnoDB;`,
    );
    this.addSql(`alter table \`uploads\` add index \`uploads_team_id_index\`(\`team_id\`);`);
    this.addSql(`alter table \`uploads\` add index \`uploads_created_by_id_index\`(\`created_by_id\`);`);

    this.addSql(
      `create table \`stations\` (\`id\` varchar(36) not null, \`event_id\` varchar(36) not null, \`code\` varchar(100) not null, \`lat_deg\` double not null, \`lon_deg\` double not null, \`height_m\` double not null, \`observer_id\` varchar(36) null, \`observer_name\` varchar(200) null, \`aperture_mm\` double null, \`camera\` varchar(200) null, \`exposure_seconds\` double null, \`time_source\` varchar(200) null, \`position\` int not null, primary key (\`id\`)) default character set utf8mb4 engine = InnoDB;`,
    );
    this.addSql(`alter table \`stations\` add index \`stations_event_id_index\`(\`event_id\`);`);
    this.addSql(`alter table \`stations\` add index \`stations_observer_id_index\`(\`observer_id\`);`);
    this.addSql(
      `alter table \`stations\` add unique \`stations_event_id_code_unique\`(\`event_id\`, \`code\`);`,
    );

    this.addSql(
      `create table \`reports\` (\`id\` varchar(36) not null, \`event_id\` varchar(36) not null, \`station_id\` varchar(36) not null, \`author_id\` varchar(36) not null, \`result\` varchar(32) not null, \`disappearance\` json null, \`reappearance\` json null, \`observed_from_utc\` varchar(40) null, \`observed_to_utc\` varchar(40) null, \`ring_dips\` json not null, \`notes\` text null, \`light_curve_id\` varchar(36) null, \`state\` varchar(16) not null default 'submitted', \`reject_reason\` text null, \`created_at\` datetime not null, \`updated_at\` datetime not null, primary key (\`id\`)) default character set utf8mb4 engine = InnoDB;`,
    );
    this.addSql(`alter table \`reports\` add index \`reports_event_id_index\`(\`event_id\`);`);
    this.addSql(`alter table \`reports\` add index \`reports_station_id_index\`(\`station_id\`);`);
    this.addSql(`alter table \`reports\` add index \`reports_author_id_index\`(\`author_id\`);`);
    this.addSql(`alter table \`reports\` add index \`reports_light_curve_id_index\`(\`light_curve_id\`);`);
    this.addSql(
      `alter table \`reports\` add index \`reports_event_id_author_id_index\`(\`event_id\`, \`author_id\`);`,
    );

    this.addSql(
      `create table \`ring_events\` (\`id\` varchar(36) not null, \`event_id\` varchar(36) not null, \`station_id\` varchar(36) not null, \`ring\` varchar(100) not null, \`start\` json not null, \`end\` json not null, \`report_id\` varchar(36) null, \`position\` int not null, primary key (\`id\`)) default character set utf8mb4 engine = InnoDB;`,
    );
    this.addSql(`alter table \`ring_events\` add index \`ring_events_event_id_index\`(\`event_id\`);`);
    this.addSql(`alter table \`ring_events\` add index \`ring_events_station_id_index\`(\`station_id\`);`);
    this.addSql(`alter table \`ring_events\` add index \`ring_events_report_id_index\`(\`report_id\`);`);

    this.addSql(
      `create table \`chords\` (\`id\` varchar(36) not null, \`event_id\` varchar(36) not null, \`station_id\` varchar(36) not null, \`type\` varchar(16) not null, \`disappearance\` json null, \`reappearance\` json null, \`start_utc\` varchar(40) null, \`end_utc\` varchar(40) null, \`time_offset_seconds\` double not null default 0, \`source\` varchar(16) not null, \`report_id\` varchar(36) null, \`position\` int not null default 0, \`created_at\` datetime not null, \`updated_at\` datetime not null, primary key (\`id\`)) default character set utf8mb4 engine = InnoDB;`,
    );
    this.addSql(`alter table \`chords\` add index \`chords_event_id_index\`(\`event_id\`);`);
    this.addSql(`alter table \`chords\` add index \`chords_station_id_index\`(\`station_id\`);`);
    this.addSql(`alter table \`chords\` add index \`chords_report_id_index\`(\`report_id\`);`);
    this.addSql(`alter table \`chords\` add unique \`chords_report_id_unique\`(\`report_id\`);`);

    this.addSql(
      `create table \`fit_runs\` (\`id\` varchar(36) not null, \`event_id\` varchar(36) not null, \`created_by_id\` varchar(36) not null, \`input\` longtext not null, \`input_sha256\` varchar(64) not null, \`options\` json not null, \`engine_version\` varchar(40) not null, \`seed\` int not null, \`state\` varchar(16) not null, \`progress\` int not null, \`error\` text null, \`solution\` json null, \`idempotency_key\` varchar(200) null, \`attempts\` int not null, \`review_state\` varchar(16) not null, \`created_at\` datetime not null, \`started_at\` datetime null, \`finished_at\` datetime null, primary key (\`id\`)) default character set utf8mb4 engine = InnoDB;`,
    );
    this.addSql(`alter table \`fit_runs\` add index \`fit_runs_event_id_index\`(\`event_id\`);`);
    this.addSql(`alter table \`fit_runs\` add index \`fit_runs_created_by_id_index\`(\`created_by_id\`);`);
    this.addSql(
      `alter table \`fit_runs\` add index \`fit_runs_event_id_created_at_index\`(\`event_id\`, \`created_at\`);`,
    );
    this.addSql(
      `alter table \`fit_runs\` add unique \`fit_runs_event_id_created_by_id_idempotency_key_unique\`(\`event_id\`, \`created_by_id\`, \`idempotency_key\`);`,
    );

    this.addSql(
      `create table \`reviews\` (\`id\` varchar(36) not null, \`fit_id\` varchar(36) not null, \`reviewer_id\` varchar(36) not null, \`decision\` varchar(16) not null, \`comment\` text not null, \`created_at\` datetime not null, primary key (\`id\`)) default character set utf8mb4 engine = InnoDB;`,
    );
    this.addSql(`alter table \`reviews\` add index \`reviews_fit_id_index\`(\`fit_id\`);`);
    this.addSql(`alter table \`reviews\` add index \`reviews_reviewer_id_index\`(\`reviewer_id\`);`);

    this.addSql(
      `alter table \`events\` add constraint \`events_team_id_foreign\` foreign key (\`team_id\`) references \`teams\` (\`id\`) on update cascade on delete cascade;`,
    );

    this.addSql(
      `alter table \`uploads\` add constraint \`uploads_team_id_foreign\` foreign key (\`team_id\`) references \`teams\` (\`id\`) on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table \`uploads\` add constraint \`uploads_created_by_id_foreign\` foreign key (\`created_by_id\`) references \`users\` (\`id\`) on update cascade on delete set null;`,
    );

    this.addSql(
      `alter table \`stations\` add constraint \`stations_event_id_foreign\` foreign key (\`event_id\`) references \`events\` (\`id\`) on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table \`stations\` add constraint \`stations_observer_id_foreign\` foreign key (\`observer_id\`) references \`users\` (\`id\`) on update cascade on delete set null;`,
    );

    this.addSql(
      `alter table \`reports\` add constraint \`reports_event_id_foreign\` foreign key (\`event_id\`) references \`events\` (\`id\`) on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table \`reports\` add constraint \`reports_station_id_foreign\` foreign key (\`station_id\`) references \`stations\` (\`id\`) on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table \`reports\` add constraint \`reports_author_id_foreign\` foreign key (\`author_id\`) references \`users\` (\`id\`) on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table \`reports\` add constraint \`reports_light_curve_id_foreign\` foreign key (\`light_curve_id\`) references \`uploads\` (\`id\`) on update cascade on delete set null;`,
    );

    this.addSql(
      `alter table \`ring_events\` add constraint \`ring_events_event_id_foreign\` foreign key (\`event_id\`) references \`events\` (\`id\`) on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table \`ring_events\` add constraint \`ring_events_station_id_foreign\` foreign key (\`station_id\`) references \`stations\` (\`id\`) on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table \`ring_events\` add constraint \`ring_events_report_id_foreign\` foreign key (\`report_id\`) references \`reports\` (\`id\`) on update cascade on delete set null;`,
    );

    this.addSql(
      `alter table \`chords\` add constraint \`chords_event_id_foreign\` foreign key (\`event_id\`) references \`events\` (\`id\`) on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table \`chords\` add constraint \`chords_station_id_foreign\` foreign key (\`station_id\`) references \`stations\` (\`id\`) on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table \`chords\` add constraint \`chords_report_id_foreign\` foreign key (\`report_id\`) references \`reports\` (\`id\`) on update cascade on delete set null;`,
    );

    this.addSql(
      `alter table \`fit_runs\` add constraint \`fit_runs_event_id_foreign\` foreign key (\`event_id\`) references \`events\` (\`id\`) on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table \`fit_runs\` add constraint \`fit_runs_created_by_id_foreign\` foreign key (\`created_by_id\`) references \`users\` (\`id\`) on update cascade on delete cascade;`,
    );

    this.addSql(
      `alter table \`reviews\` add constraint \`reviews_fit_id_foreign\` foreign key (\`fit_id\`) references \`fit_runs\` (\`id\`) on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table \`reviews\` add constraint \`reviews_reviewer_id_foreign\` foreign key (\`reviewer_id\`) references \`users\` (\`id\`) on update cascade on delete cascade;`,
    );
  }

  override async down(): Promise<void> {
    this.addSql(`alter table \`stations\` drop foreign key \`stations_event_id_foreign\`;`);

    this.addSql(`alter table \`reports\` drop foreign key \`reports_event_id_foreign\`;`);

    this.addSql(`alter table \`ring_events\` drop foreign key \`ring_events_event_id_foreign\`;`);

    this.addSql(`alter table \`chords\` drop foreign key \`chords_event_id_foreign\`;`);

    this.addSql(`alter table \`fit_runs\` drop foreign key \`fit_runs_event_id_foreign\`;`);

    this.addSql(`alter table \`reports\` drop foreign key \`reports_light_curve_id_foreign\`;`);

    this.addSql(`alter table \`reports\` drop foreign key \`reports_station_id_foreign\`;`);

    this.addSql(`alter table \`ring_events\` drop foreign key \`ring_events_station_id_foreign\`;`);

    this.addSql(`alter table \`chords\` drop foreign key \`chords_station_id_foreign\`;`);

    this.addSql(`alter table \`ring_events\` drop foreign key \`ring_events_report_id_foreign\`;`);

    this.addSql(`alter table \`chords\` drop foreign key \`chords_report_id_foreign\`;`);

    this.addSql(`alter table \`reviews\` drop foreign key \`reviews_fit_id_foreign\`;`);

    this.addSql(`drop table if exists \`audit_entries\`;`);

    this.addSql(`drop table if exists \`events\`;`);

    this.addSql(`drop table if exists \`uploads\`;`);

    this.addSql(`drop table if exists \`stations\`;`);

    this.addSql(`drop table if exists \`reports\`;`);

    this.addSql(`drop table if exists \`ring_events\`;`);

    this.addSql(`drop table if exists \`chords\`;`);

    this.addSql(`drop table if exists \`fit_runs\`;`);

    this.addSql(`drop table if exists \`reviews\`;`);
  }
}
