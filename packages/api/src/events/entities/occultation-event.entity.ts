import { randomUUID } from 'node:crypto';
import { Entity, Index, ManyToOne, Opt, PrimaryKey, Property } from '@mikro-orm/core';
import type { EphemerisRow, FitOptions, PredictionSettings, StarInput, TimeScale } from '@limbus/geometry';
import { type PredictionOffsetSource, TEXT_LIMITS } from '@limbus/schema';
import { Body } from '../../bodies/entities/body.entity';
import { Team } from '../../teams/entities/team.entity';

export const EVENT_STATES = ['active', 'deleted'] as const;
export type EventState = (typeof EVENT_STATES)[number];

/** Named apart from the DOM/Node global `Event`; the table is still `events`. */
@Entity({ tableName: 'events' })
@Index({ properties: ['team', 'state'] })
@Index({ properties: ['team', 'state', 'eventTimeUtc'] })
export class OccultationEvent {
  @PrimaryKey({ type: 'string', length: 36 })
  id: string = randomUUID();

  @ManyToOne({ entity: () => Team, deleteRule: 'cascade' })
  team: Team;

  /** The body observed; a body with events cannot be deleted. */
  @ManyToOne({ entity: () => Body, deleteRule: 'no action' })
  body: Body;

  @Property({ type: 'string', length: TEXT_LIMITS.eventTitle })
  title: string;

  /**
   * When the event happens, "YYYY-MM-DDThh:mm:ssZ" (UTC, whole seconds, so the text sorts in time order).
   * Given by the coordinator, else its earliest chord or the middle of its ephemeris (defaultEventTimeUtc).
   */
  @Property({ type: 'string', length: 20 })
  eventTimeUtc: string;

  @Property({ type: 'json' })
  star: StarInput;

  @Property({ type: 'json' })
  ephemeris: { timeScale: TimeScale; rows: EphemerisRow[] };

  @Property({ type: 'json' })
  earthRotation: { dut1Seconds: number };

  /** The `fit` section of an imported event file; a fit request's options overlay it key by key. */
  @Property({ type: 'json' })
  fitDefaults: FitOptions;

  /**
   * The event file's `prediction` section (defaults applied), from which the shadow path is predicted;
   * null until someone sets it. A write raises `revision`, which keys the cached prediction.
   */
  @Property({ type: 'json', nullable: true })
  prediction: (PredictionSettings & Opt) | null = null;

  /**
   * Which solved fit `prediction.offsetMas` and `uncertaintyMas` were taken from; not part of the event
   * file, and dropped when either is edited by hand.
   */
  @Property({ type: 'json', nullable: true })
  predictionSource: (PredictionOffsetSource & Opt) | null = null;

  @Property({ type: 'string', length: 16 })
  state: EventState & Opt = 'active';

  @Property({ type: 'datetime', nullable: true })
  deletedAt: (Date & Opt) | null = null;

  @Property({ type: 'string', length: 36, nullable: true })
  createdById: (string & Opt) | null = null;

  @Property({ type: 'datetime' })
  createdAt: Date & Opt = new Date();

  @Property({ type: 'datetime', onUpdate: () => new Date() })
  updatedAt: Date & Opt = new Date();

  /**
   * Rises with every write to this event or its stations, chords and ring events. Database triggers
   * keep it (migration Migration20261202033000_event_revision); nothing in the code sets it, and a
   * loaded entity's value may be stale: read it fresh where it matters (EventDetailCache).
   */
  @Property({ type: 'integer', unsigned: true, default: 0 })
  revision: number & Opt = 0;

  constructor(
    team: Team,
    body: Body,
    fields: Pick<
      OccultationEvent,
      'title' | 'eventTimeUtc' | 'star' | 'ephemeris' | 'earthRotation' | 'fitDefaults'
    >,
  ) {
    this.team = team;
    this.body = body;
    this.title = fields.title;
    this.eventTimeUtc = fields.eventTimeUtc;
    this.star = fields.star;
    this.ephemeris = fields.ephemeris;
    this.earthRotation = fields.earthRotation;
    this.fitDefaults = fields.fitDefaults;
  }
}
