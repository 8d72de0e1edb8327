import { PasswordResetToken } from '../auth/entities/password-reset-token.entity';
import { RefreshToken } from '../auth/entities/refresh-token.entity';
import { AuditEntry } from '../audit/entities/audit-entry.entity';
import { Body } from '../bodies/entities/body.entity';
import { Chi2MapRun } from '../chi2-maps/entities/chi2-map-run.entity';
import { Chord } from '../chords/entities/chord.entity';
import { DynamicsContext } from '../dynamics/entities/dynamics-context.entity';
import { RingEvent } from '../chords/entities/ring-event.entity';
import { OccultationEvent } from '../events/entities/occultation-event.entity';
import { FitRun } from '../fits/entities/fit-run.entity';
import { Invitation } from '../invitations/entities/invitation.entity';
import { ReportCorrection } from '../reports/entities/report-correction.entity';
import { Report } from '../reports/entities/report.entity';
import { Review } from '../reviews/entities/review.entity';
import { Station } from '../stations/entities/station.entity';
import { Membership } from '../teams/entities/membership.entity';
import { Team } from '../teams/entities/team.entity';
import { LightCurveTiming } from '../timings/entities/light-curve-timing.entity';
import { Upload } from '../uploads/entities/upload.entity';
import { User } from '../users/entities/user.entity';

/**
 * Listed by hand: folder globs do not work once vitest or a bundler loads the code.
 * Feature modules added later append their entities here.
 */
export const ENTITIES = [
  User,
  Team,
  Membership,
  Body,
  Invitation,
  RefreshToken,
  PasswordResetToken,
  OccultationEvent,
  Station,
  Upload,
  Report,
  ReportCorrection,
  Chord,
  RingEvent,
  FitRun,
  Review,
  AuditEntry,
  LightCurveTiming,
  DynamicsContext,
  Chi2MapRun,
];
