import { Migration } from '@mikro-orm/migrations';

export class Migration20261201235328 extends Migration {
  override async up(): Promise<void> {
    this.addSql(
      `create table \`teams\` (\`id\` varchar(36) not null, \`name\` varchar(200) not null, \`created_at\` datetime not null, primary key (\`id\`)) default character set utf8mb4 engine = InnoDB;`,
    );

    this.addSql(
      `create table \`users\` (\`id\` varchar(36) not null, \`email\` varchar(254) not null, \`name\` varchar(200) not null, \`password_hash\` varchar(255) not null, \`is_admin\` tinyint(1) not null, \`created_at\` datetime not null, primary key (\`id\`)) default character set utf8mb4 engine = InnoDB;`,
    );
    this.addSql(`alter table \`users\` add unique \`users_email_unique\`(\`email\`);`);

    this.addSql(
      `create table \`refresh_tokens\` (\`id\` varchar(36) not null, \`user_id\` varchar(36) not null, \`token_hash\` varchar(64) not null, \`expires_at\` datetime not null, \`revoked_at\` datetime null, \`created_at\` datetime not null, primary key (\`id\`)) default character set utf8mb4 engine = InnoDB;`,
    );
    this.addSql(`alter table \`refresh_tokens\` add index \`refresh_tokens_user_id_index\`(\`user_id\`);`);
    this.addSql(
      `alter table \`refresh_tokens\` add unique \`refresh_tokens_token_hash_unique\`(\`token_hash\`);`,
    );
    this.addSql(
      `alter table \`refresh_tokens\` add index \`refresh_tokens_revoked_at_index\`(\`revoked_at\`);`,
    );

    this.addSql(
      `create table \`password_reset_tokens\` (\`id\` varchar(36) not null, \`user_id\` varchar(36) not null, \`token_hash\` varchar(64) not null, \`expires_at\` datetime not null, \`used_at\` datetime null, \`created_at\` datetime not null, primary key (\`id\`)) default character set utf8mb4 engine = InnoDB;`,
    );
    this.addSql(
      `alter table \`password_reset_tokens\` add index \`password_reset_tokens_user_id_index\`(\`user_id\`);`,
    );
    this.addSql(
      `alter table \`password_reset_tokens\` add unique \`password_reset_tokens_token_hash_unique\`(\`token_hash\`);`,
    );

    this.addSql(
      `create table \`memberships\` (\`id\` varchar(36) not null, \`team_id\` varchar(36) not null, \`user_id\` varchar(36) not null, \`roles\` json not null, \`created_at\` datetime not null, primary key (\`id\`)) default character set utf8mb4 engine = InnoDB;`,
    );
    this.addSql(`alter table \`memberships\` add index \`memberships_team_id_index\`(\`team_id\`);`);
    this.addSql(`alter table \`memberships\` add index \`memberships_user_id_index\`(\`user_id\`);`);
    this.addSql(
      `alter table \`memberships\` add unique \`memberships_team_id_user_id_unique\`(\`team_id\`, \`user_id\`);`,
    );

    this.addSql(
      `create table \`invitations\` (\`id\` varchar(36) not null, \`team_id\` varchar(36) not null, \`email\` varchar(254) not null, \`role\` varchar(32) not null, \`token_hash\` varchar(64) not null, \`invited_by_id\` varchar(36) not null, \`expires_at\` datetime not null, \`accepted_at\` datetime null, \`created_at\` datetime not null, primary key (\`id\`)) default character set utf8mb4 engine = InnoDB;`,
    );
    this.addSql(`alter table \`invitations\` add index \`invitations_team_id_index\`(\`team_id\`);`);
    this.addSql(`alter table \`invitations\` add unique \`invitations_token_hash_unique\`(\`token_hash\`);`);
    this.addSql(
      `alter table \`invitations\` add index \`invitations_invited_by_id_index\`(\`invited_by_id\`);`,
    );

    this.addSql(
      `alter table \`refresh_tokens\` add constraint \`refresh_tokens_user_id_foreign\` foreign key (\`user_id\`) references \`users\` (\`id\`) on update cascade on delete cascade;`,
    );

    this.addSql(
      `alter table \`password_reset_tokens\` add constraint \`password_reset_tokens_user_id_foreign\` foreign key (\`user_id\`) references \`users\` (\`id\`) on update cascade on delete cascade;`,
    );

    this.addSql(
      `alter table \`memberships\` add constraint \`memberships_team_id_foreign\` foreign key (\`team_id\`) references \`teams\` (\`id\`) on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table \`memberships\` add constraint \`memberships_user_id_foreign\` foreign key (\`user_id\`) references \`users\` (\`id\`) on update cascade on delete cascade;`,
    );

    this.addSql(
      `alter table \`invitations\` add constraint \`invitations_team_id_foreign\` foreign key (\`team_id\`) references \`teams\` (\`id\`) on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table \`invitations\` add constraint \`invitations_invited_by_id_foreign\` foreign key (\`invited_by_id\`) references \`users\` (\`id\`) on update cascade on delete cascade;`,
    );
  }
}
