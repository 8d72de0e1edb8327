import type { TimedMark } from '@limbus/geometry';
import type { Report, ReportResult, ReportState, RingDip } from './entities/report.entity';

export interface ReportView {
  id: string;
  eventId: string;
  stationId: string;
  station: string;
  authorId: string;
  authorName: string;
  result: ReportResult;
  disappearance: TimedMark | null;
  reappearance: TimedMark | null;
  observedFromUtc: string | null;
  observedToUtc: string | null;
  ringDips: RingDip[];
  notes: string | null;
  lightCurve: { id: string; name: string; sizeBytes: number; sha256: string } | null;
  state: ReportState;
  rejectReason: string | null;
  createdAt: string;
  updatedAt: string;
}

export function reportView(r: Report): ReportView {
  return {
    id: r.id,
    eventId: r.event.id,
    stationId: r.station.id,
    station: r.station.code,
    authorId: r.author.id,
    authorName: r.author.name,
    result: r.result,
    disappearance: r.disappearance,
    reappearance: r.reappearance,
    observedFromUtc: r.observedFromUtc,
    observedToUtc: r.observedToUtc,
    ringDips: r.ringDips,
    notes: r.notes,
    lightCurve: r.lightCurve
      ? {
          id: r.lightCurve.id,
          name: r.lightCurve.name,
          sizeBytes: r.lightCurve.sizeBytes,
          sha256: r.lightCurve.sha256,
        }
      : null,
    state: r.state,
    rejectReason: r.rejectReason,
    createdAt: r.createdAt.toISOString(),
    updatedAt: r.updatedAt.toISOString(),
  };
}
