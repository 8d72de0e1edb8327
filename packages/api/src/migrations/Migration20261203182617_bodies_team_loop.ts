import { randomUUID } from 'node:crypto';
import { Migration } from '@mikro-orm/migrations';
import type { EventInput } from '@limbus/geometry';
import { defaultEventTimeUtc, eventDataSha256, wholeSecondUtc } from '../events/event-data';

type Row = Record<string, unknown>;

/** MariaDB hands JSON columns back as text. */
function json<T>(value: unknown): T {
  return (typeof value === 'string' ? JSON.parse(value) : value) as T;
}

const text = (value: unknown): string => {
  if (typeof value !== 'string') throw new Error(`expected a text column, got ${typeof value}`);
  return value;
};

/**
 * Bodies, and what the team's loop in the browser needs: event time, chord provenance, invitation roles,
 * notice settings, report corrections, fit data hashes.
 *
 * Existing data: every team with events gets one body named "Unassigned" holding all of them, for a
 * coordinator to rename or split (an event's body is editable). A body's physical parameters used to be
 * stored per event; the newest document of a team's events becomes the body's, and any other, differing
 * document is kept whole in the audit log (action "dynamics.superseded") so nothing is lost. Each event
 * gets its time from its earliest chord, else from the middle of its ephemeris. Each fit gets the hash of
 * the event data in its stored input. Open invitations keep their role as a one-role list; of two open
 * invitations to one address in one team the newer stays open.
 *
 * Statements run one by one with `execute`, because data steps sit between the schema steps.
 */
export class Migration20261203182617 extends Migration {
  override async up(): Promise<void> {
    const sql = (statement: string, params?: unknown[]) => this.execute(statement, params);

    await sql(
      'create table `bodies` (`id` varchar(36) not null, `team_id` varchar(36) not null, `name` varchar(200) not null, `designation` varchar(100) null, `created_by_id` varchar(36) null, `created_at` datetime not null, `updated_at` datetime not null, primary key (`id`)) default character set utf8mb4 engine = InnoDB;',
    );
    await sql('alter table `bodies` add index `bodies_team_id_index`(`team_id`);');
    await sql('alter table `bodies` add unique `bodies_team_id_name_unique`(`team_id`, `name`);');
    await sql(
      'alter table `bodies` add constraint `bodies_team_id_foreign` foreign key (`team_id`) references `teams` (`id`) on update cascade on delete cascade;',
    );

    await sql(
      'create table `report_corrections` (`id` varchar(36) not null, `report_id` varchar(36) not null, `author_id` varchar(36) not null, `changes` json not null, `message` text not null, `state` varchar(16) not null, `open_report_id` varchar(36) null, `decided_by_id` varchar(36) null, `reason` text null, `created_at` datetime(3) not null, `decided_at` datetime null, primary key (`id`)) default character set utf8mb4 engine = InnoDB;',
    );
    await sql(
      'alter table `report_corrections` add index `report_corrections_report_id_index`(`report_id`);',
    );
    await sql(
      'alter table `report_corrections` add index `report_corrections_author_id_index`(`author_id`);',
    );
    await sql(
      'alter table `report_corrections` add index `report_corrections_decided_by_id_index`(`decided_by_id`);',
    );
    await sql(
      'alter table `report_corrections` add unique `report_corrections_open_report_id_unique`(`open_report_id`);',
    );
    await sql(
      'alter table `report_corrections` add constraint `report_corrections_report_id_foreign` foreign key (`report_id`) references `reports` (`id`) on update cascade on delete cascade;',
    );
    await sql(
      'alter table `report_corrections` add constraint `report_corrections_author_id_foreign` foreign key (`author_id`) references `users` (`id`) on update cascade on delete cascade;',
    );
    await sql(
      'alter table `report_corrections` add constraint `report_corrections_decided_by_id_foreign` foreign key (`decided_by_id`) references `users` (`id`) on update cascade on delete set null;',
    );

    // Events: a body and an event time, filled before they become required.
    await sql('alter table `events` add `body_id` varchar(36) null, add `event_time_utc` varchar(20) null;');
    const teams = (await sql('select distinct `team_id` from `events`')) as Row[];
    for (const { team_id: teamId } of teams) {
      const bodyId = randomUUID();
      await sql(
        "insert into `bodies` (`id`, `team_id`, `name`, `designation`, `created_by_id`, `created_at`, `updated_at`) values (?, ?, 'Unassigned', null, null, utc_timestamp(), utc_timestamp())",
        [bodyId, teamId],
      );
      await sql('update `events` set `body_id` = ? where `team_id` = ?', [bodyId, teamId]);
    }
    const events = (await sql('select `id`, `ephemeris` from `events`')) as Row[];
    for (const event of events) {
      const chords = (await sql('select `disappearance`, `start_utc` from `chords` where `event_id` = ?', [
        event.id,
      ])) as Row[];
      const times = chords
        .map((c) => json<{ time: string } | null>(c.disappearance)?.time ?? (c.start_utc as string | null))
        .filter((t): t is string => typeof t === 'string')
        .sort();
      const first = times[0];
      const eventTime =
        first === undefined
          ? defaultEventTimeUtc({ ephemeris: json<EventInput['ephemeris']>(event.ephemeris) })
          : wholeSecondUtc(first);
      await sql('update `events` set `event_time_utc` = ? where `id` = ?', [eventTime, event.id]);
    }
    await sql(
      'alter table `events` modify `body_id` varchar(36) not null, modify `event_time_utc` varchar(20) not null;',
    );
    await sql(
      'alter table `events` add constraint `events_body_id_foreign` foreign key (`body_id`) references `bodies` (`id`) on update cascade on delete no action;',
    );
    await sql('alter table `events` add index `events_body_id_index`(`body_id`);');
    await sql(
      'alter table `events` add index `events_team_id_state_event_time_utc_index`(`team_id`, `state`, `event_time_utc`);',
    );

    await sql('alter table `users` add `notice_opt_outs` json null;');
    await sql("update `users` set `notice_opt_outs` = '[]';");
    await sql('alter table `users` modify `notice_opt_outs` json not null;');

    await sql('alter table `reports` add `times_from_light_curve` tinyint(1) not null default false;');

    await sql('alter table `chords` add `timing_id` varchar(36) null;');
    await sql(
      'alter table `chords` add constraint `chords_timing_id_foreign` foreign key (`timing_id`) references `light_curve_timings` (`id`) on update cascade on delete set null;',
    );
    await sql('alter table `chords` add index `chords_timing_id_index`(`timing_id`);');

    // Invitations: a list of roles, and the open address that the unique key watches.
    await sql(
      'alter table `invitations` add `roles` json null, add `open_email` varchar(254) null, add `revoked_at` datetime null, add `last_sent_at` datetime null;',
    );
    await sql(
      'update `invitations` set `roles` = json_array(`role`), `last_sent_at` = `created_at`, `open_email` = if(`accepted_at` is null, `email`, null);',
    );
    const open = (await sql(
      'select `id`, `team_id`, `email` from `invitations` where `open_email` is not null order by `created_at` desc, `id` desc',
    )) as Row[];
    const seen = new Set<string>();
    for (const invitation of open) {
      const key = `${text(invitation.team_id)} ${text(invitation.email)}`;
      if (seen.has(key))
        await sql(
          'update `invitations` set `open_email` = null, `revoked_at` = utc_timestamp() where `id` = ?',
          [invitation.id],
        );
      seen.add(key);
    }
    await sql(
      'alter table `invitations` modify `roles` json not null, modify `last_sent_at` datetime not null;',
    );
    await sql('alter table `invitations` drop column `role`;');
    await sql(
      'alter table `invitations` add unique `invitations_team_id_open_email_unique`(`team_id`, `open_email`);',
    );

    // Fits: the hash of the event data each was run on.
    await sql('alter table `fit_runs` add `data_sha256` varchar(64) null;');
    const fitIds = (await sql('select `id` from `fit_runs`')) as Row[];
    for (const { id } of fitIds) {
      const [fit] = (await sql('select `input` from `fit_runs` where `id` = ?', [id])) as Row[];
      const input = json<EventInput>(fit?.input);
      await sql('update `fit_runs` set `data_sha256` = ? where `id` = ?', [eventDataSha256(input), id]);
    }
    await sql('alter table `fit_runs` modify `data_sha256` varchar(64) not null;');

    // Dynamics contexts: from the event to the event's body, the newest per body kept.
    await sql('alter table `dynamics_contexts` add `body_id` varchar(36) null;');
    await sql(
      'update `dynamics_contexts` d join `events` e on e.`id` = d.`event_id` set d.`body_id` = e.`body_id`;',
    );
    const contexts = (await sql(
      'select d.`id`, d.`body_id`, d.`event_id`, d.`document`, d.`updated_by_id`, e.`team_id` from `dynamics_contexts` d join `events` e on e.`id` = d.`event_id` order by d.`updated_at` desc, d.`id` desc',
    )) as Row[];
    const kept = new Map<string, string>();
    for (const context of contexts) {
      const bodyId = text(context.body_id);
      const keptDocument = kept.get(bodyId);
      const document = JSON.stringify(json<unknown>(context.document));
      if (keptDocument === undefined) {
        kept.set(bodyId, document);
        continue;
      }
      if (keptDocument !== document)
        await sql(
          "insert into `audit_entries` (`id`, `team_id`, `event_id`, `actor_id`, `action`, `object_type`, `object_id`, `detail`, `created_at`) values (?, ?, ?, null, 'dynamics.superseded', 'body', ?, ?, utc_timestamp(3))",
          [
            randomUUID(),
            context.team_id,
            context.event_id,
            bodyId,
            JSON.stringify({
              reason: 'the body has a newer physical-parameter document from another event',
              document: json<unknown>(context.document),
              updatedById: context.updated_by_id ?? null,
            }),
          ],
        );
      await sql('delete from `dynamics_contexts` where `id` = ?', [context.id]);
    }
    await sql('alter table `dynamics_contexts` drop foreign key `dynamics_contexts_event_id_foreign`;');
    await sql('alter table `dynamics_contexts` drop index `dynamics_contexts_event_id_index`;');
    await sql('alter table `dynamics_contexts` drop index `dynamics_contexts_event_id_unique`;');
    await sql('alter table `dynamics_contexts` drop column `event_id`;');
    await sql('alter table `dynamics_contexts` modify `body_id` varchar(36) not null;');
    await sql(
      'alter table `dynamics_contexts` add constraint `dynamics_contexts_body_id_foreign` foreign key (`body_id`) references `bodies` (`id`) on update cascade on delete cascade;',
    );
    await sql('alter table `dynamics_contexts` add index `dynamics_contexts_body_id_index`(`body_id`);');
    await sql('alter table `dynamics_contexts` add unique `dynamics_contexts_body_id_unique`(`body_id`);');

    // An event's detail view names its body; a renamed body must reach the views cached under the revision.
    await sql(
      'create trigger `bodies_revision_on_update` after update on `bodies` for each row ' +
        'update `events` set `revision` = `revision` + 1 where `body_id` = new.`id`;',
    );
  }

  /**
   * Back to one context per event (the body's, copied to each of its events) and one role per
   * invitation (the first); bodies, corrections, notice settings and chord provenance are dropped.
   */
  override async down(): Promise<void> {
    const sql = (statement: string, params?: unknown[]) => this.execute(statement, params);
    await sql('drop trigger if exists `bodies_revision_on_update`;');

    await sql('alter table `dynamics_contexts` add `event_id` varchar(36) null;');
    const contexts = (await sql(
      'select `id`, `body_id`, `document`, `updated_by_id`, `created_at`, `updated_at` from `dynamics_contexts`',
    )) as Row[];
    await sql('alter table `dynamics_contexts` drop foreign key `dynamics_contexts_body_id_foreign`;');
    await sql('alter table `dynamics_contexts` drop index `dynamics_contexts_body_id_unique`;');
    await sql('alter table `dynamics_contexts` drop index `dynamics_contexts_body_id_index`;');
    await sql('delete from `dynamics_contexts`;');
    await sql('alter table `dynamics_contexts` drop column `body_id`;');
    for (const context of contexts) {
      const events = (await sql('select `id` from `events` where `body_id` = ?', [context.body_id])) as Row[];
      for (const event of events)
        await sql(
          'insert into `dynamics_contexts` (`id`, `event_id`, `document`, `updated_by_id`, `created_at`, `updated_at`) values (?, ?, ?, ?, ?, ?)',
          [
            randomUUID(),
            event.id,
            JSON.stringify(json<unknown>(context.document)),
            context.updated_by_id,
            context.created_at,
            context.updated_at,
          ],
        );
    }
    await sql('alter table `dynamics_contexts` modify `event_id` varchar(36) not null;');
    await sql(
      'alter table `dynamics_contexts` add constraint `dynamics_contexts_event_id_foreign` foreign key (`event_id`) references `events` (`id`) on update cascade on delete cascade;',
    );
    await sql('alter table `dynamics_contexts` add index `dynamics_contexts_event_id_index`(`event_id`);');
    await sql('alter table `dynamics_contexts` add unique `dynamics_contexts_event_id_unique`(`event_id`);');

    await sql('alter table `fit_runs` drop column `data_sha256`;');

    await sql('alter table `invitations` drop index `invitations_team_id_open_email_unique`;');
    await sql('alter table `invitations` add `role` varchar(32) null;');
    await sql("update `invitations` set `role` = json_unquote(json_extract(`roles`, '$[0]'));");
    await sql('alter table `invitations` modify `role` varchar(32) not null;');
    await sql(
      'alter table `invitations` drop column `roles`, drop column `open_email`, drop column `revoked_at`, drop column `last_sent_at`;',
    );

    await sql('alter table `chords` drop foreign key `chords_timing_id_foreign`;');
    await sql('alter table `chords` drop index `chords_timing_id_index`;');
    await sql('alter table `chords` drop column `timing_id`;');
    await sql('alter table `reports` drop column `times_from_light_curve`;');
    await sql('alter table `users` drop column `notice_opt_outs`;');

    await sql('alter table `events` drop foreign key `events_body_id_foreign`;');
    await sql('alter table `events` drop index `events_body_id_index`;');
    await sql('alter table `events` drop index `events_team_id_state_event_time_utc_index`;');
    await sql('alter table `events` drop column `body_id`, drop column `event_time_utc`;');

    await sql('drop table if exists `report_corrections`;');
    await sql('drop table if exists `bodies`;');
  }
}
