import { Badge, Body1, Button, makeStyles, Subtitle2, tokens } from '@fluentui/react-components';
import { useState } from 'react';
import type { Report } from '../api/get-reports';
import { useLightCurve } from '../api/get-light-curve';
import { CorrectionCard } from './correction-card';
import { ReportForm, type ReportStation } from './report-form';
import { pendingCorrection, RESULT_WORDS, stateText } from './report-text';
import { FormError } from '@/components/form-error';
import { LightCurvePlot } from '@/components/light-curve-plot';
import { Loading, RequestFailed } from '@/components/request-state';
import { chordSourceText, markText } from '@/components/timing-text';
import { utcText } from '@/lib/utc-text';

const useStyles = makeStyles({
  card: {
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalM,
    padding: tokens.spacingHorizontalM,
    border: `1px solid ${tokens.colorNeutralStroke2}`,
    borderRadius: tokens.borderRadiusMedium,
  },
  list: { margin: 0, paddingInlineStart: tokens.spacingHorizontalL },
  time: { fontFamily: tokens.fontFamilyMonospace },
});

/** The observer's own curve as uploaded, marked with the times the chord holds (or the report's own). */
function RawLightCurve({ eventId, report }: { eventId: string; report: Report }) {
  const file = report.lightCurve;
  const curve = useLightCurve(eventId, report.id, file?.sha256 ?? null);
  if (file === null) return <Body1 as="p">No light curve uploaded.</Body1>;
  if (curve.isPending) return <Loading label="Loading your light curve…" />;
  if (curve.isError)
    return <RequestFailed what="your light curve" error={curve.error} onRetry={() => void curve.refetch()} />;
  const { parse, originUtc } = curve.data;
  if (!parse.ok || originUtc === null)
    return (
      <FormError
        title={`${file.name} could not be read`}
        message={parse.ok ? 'no samples' : parse.problems.map((p) => `${p.path}: ${p.message}`).join('; ')}
      />
    );
  const marks = report.chord ?? report;
  return (
    <LightCurvePlot
      stationLabel={report.station}
      result={{
        series: {
          originUtc,
          timesSeconds: parse.curve.timesSeconds,
          flux: parse.curve.flux,
          modelFlux: null,
        },
        disappearance: marks.disappearance,
        reappearance: marks.reappearance,
        dips: report.ringDips.map((d) => ({ start: d.start, end: d.end, marked: false })),
      }}
    />
  );
}

function TimingText({ report }: { report: Report }) {
  const styles = useStyles();
  const t = report.latestTiming;
  if (t === null)
    return (
      <Body1 as="p">
        {report.lightCurve === null
          ? 'Nothing to time without a light curve.'
          : 'Your light curve has not been timed yet.'}
      </Body1>
    );
  if (t.state === 'queued' || t.state === 'running')
    return <Body1 as="p">Your light curve is being timed ({t.state}).</Body1>;
  if (t.state === 'failed')
    return <Body1 as="p">The last timing of your light curve failed; a coordinator may run it again.</Body1>;
  return (
    <>
      <Body1 as="p">
        Timed{t.finishedAt ? ` on ${utcText(t.finishedAt)}` : ''}:{' '}
        <Badge appearance={t.inChord ? 'filled' : 'outline'} color={t.inChord ? 'success' : 'informative'}>
          {t.inChord ? 'in the chord' : 'not in the chord'}
        </Badge>
      </Body1>
      <ul className={styles.list}>
        <li className={styles.time}>D {markText(t.disappearance)}</li>
        <li className={styles.time}>R {markText(t.reappearance)}</li>
      </ul>
    </>
  );
}

function ChordText({ report }: { report: Report }) {
  const styles = useStyles();
  const chord = report.chord;
  if (chord === null)
    return (
      <Body1 as="p">
        {report.state === 'accepted'
          ? 'No chord stands for this report.'
          : 'No chord yet: a coordinator has not accepted this report.'}
      </Body1>
    );
  if (chord.disappearance === null && chord.reappearance === null)
    return (
      <Body1 as="p">
        The chord of this report holds no disappearance or reappearance (
        {report.result === 'negative' ? 'a negative chord' : 'no times'}).
      </Body1>
    );
  return (
    <>
      <Body1 as="p">The chord now holds these times, {chordSourceText(chord.source, 'report')}:</Body1>
      <ul className={styles.list}>
        <li className={styles.time}>D {markText(chord.disappearance)}</li>
        <li className={styles.time}>R {markText(chord.reappearance)}</li>
      </ul>
    </>
  );
}

/**
 * The observer's own report: their raw light curve, its timing once made, the times the chord holds and
 * where they came from, and the corrections asked for. An accepted report is corrected through a request.
 */
export function ReportDetails({
  eventId,
  report,
  stations,
}: {
  eventId: string;
  report: Report;
  stations: ReportStation[];
}) {
  const styles = useStyles();
  const [correcting, setCorrecting] = useState(false);
  const canAsk = report.state === 'accepted' && pendingCorrection(report) === null;
  return (
    <article className={styles.card} aria-label={`Your report for ${report.station}`}>
      <Subtitle2 as="h4">
        Your report for {report.station}: {RESULT_WORDS[report.result]}, {stateText(report)}
      </Subtitle2>
      {report.state === 'rejected' && report.rejectReason ? (
        <Body1 as="p">Rejected: {report.rejectReason}</Body1>
      ) : null}
      <RawLightCurve eventId={eventId} report={report} />
      <TimingText report={report} />
      <ChordText report={report} />
      {report.corrections.map((c) => (
        <CorrectionCard key={c.id} eventId={eventId} report={report} correction={c} canDecide={false} />
      ))}
      {canAsk && !correcting ? (
        <div>
          <Button onClick={() => setCorrecting(true)}>Ask to correct</Button>
        </div>
      ) : null}
      {correcting ? (
        <section aria-label={`Ask to correct the report for ${report.station}`}>
          <ReportForm
            eventId={eventId}
            stations={stations}
            report={report}
            mode="correction"
            onSaved={() => setCorrecting(false)}
          />
          <Button onClick={() => setCorrecting(false)}>Close the form</Button>
        </section>
      ) : null}
    </article>
  );
}
