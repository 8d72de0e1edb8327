import {
  Body1,
  Card,
  CardHeader,
  Link,
  makeStyles,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  Subtitle2,
  tokens,
} from '@fluentui/react-components';
import {
  STATION_OUTLOOK_LABELS,
  STATION_STATUS_LABELS,
  type Briefing,
  type BriefingStation,
} from '@limbus/schema/planning';
import { useBriefing } from '../api/get-briefing';
import { crossTrackText, degText, predictedTimeText, utcAt, windowText } from '../planning-text';
import { Loading, RequestFailed } from '@/components/request-state';

const useStyles = makeStyles({
  panel: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
  facts: {
    display: 'grid',
    gridTemplateColumns: 'max-content 1fr',
    gap: `${tokens.spacingVerticalXXS} ${tokens.spacingHorizontalM}`,
    margin: 0,
    '& dt': { fontWeight: tokens.fontWeightSemibold },
    '& dd': { margin: 0, fontFamily: tokens.fontFamilyMonospace },
  },
  list: { margin: 0, paddingLeft: tokens.spacingHorizontalXL },
});

function StationBriefing({ station }: { station: BriefingStation }) {
  const styles = useStyles();
  const p = station.pointing;
  const facts: Array<[string, string]> = [
    ['Outlook', STATION_OUTLOOK_LABELS[station.outlook]],
    ['Closest approach', utcAt(station.closestTimeUtc, 1)],
    [
      'Distance from the path’s centre',
      `${crossTrackText(station.crossTrackKm, station.sigmaCrossTrackKm)} (positive: left of the body's centre)`,
    ],
    ['Disappearance', predictedTimeText(station.disappearance)],
    ['Reappearance', predictedTimeText(station.reappearance)],
    ...station.rings.map((r): [string, string] => [
      `Ring ${r.ring}`,
      r.window === null ? 'outside its path' : windowText(r.window[0], r.window[1]),
    ]),
    ['Record from … to (3σ)', windowText(station.watch.fromUtc, station.watch.toUtc)],
    [
      'Star',
      `altitude ${degText(p.starAltitudeDeg)}, azimuth ${degText(p.starAzimuthDeg)} (from north through east)`,
    ],
    ['Sun', `altitude ${degText(p.sunAltitudeDeg)}`],
    [
      'Moon',
      `${degText(p.moonSeparationDeg)} from the star, ${(100 * p.moonIlluminatedFraction).toFixed(0)} % lit, altitude ${degText(p.moonAltitudeDeg)}`,
    ],
  ];
  return (
    <Card aria-label={`Briefing for ${station.code}`}>
      <CardHeader
        header={
          <Subtitle2 as="h4">
            {station.code} · {STATION_STATUS_LABELS[station.status]} · {station.latDeg.toFixed(4)}°,{' '}
            {station.lonDeg.toFixed(4)}°, {station.heightM.toFixed(0)} m
          </Subtitle2>
        }
      />
      <dl className={styles.facts}>
        {facts.map(([term, value]) => (
          <div key={term} style={{ display: 'contents' }}>
            <dt>{term}</dt>
            <dd>{value}</dd>
          </div>
        ))}
      </dl>
      {station.notes.length > 0 ? (
        <ul className={styles.list} aria-label={`Notes for ${station.code}`}>
          {station.notes.map((n) => (
            <li key={n}>{n}</li>
          ))}
        </ul>
      ) : null}
    </Card>
  );
}

/** The two lists of cautions every briefing carries, as the e-mail words them. */
function Cautions({ briefing }: { briefing: Briefing }) {
  const styles = useStyles();
  return (
    <>
      <MessageBar intent="warning" layout="multiline">
        <MessageBarBody>
          <MessageBarTitle>A prediction has an uncertainty</MessageBarTitle>
          <ul className={styles.list} aria-label="About the prediction">
            {briefing.predictionCautions.map((c) => (
              <li key={c}>{c}</li>
            ))}
          </ul>
        </MessageBarBody>
      </MessageBar>
      <MessageBar intent="warning" layout="multiline">
        <MessageBarBody>
          <MessageBarTitle>Safety</MessageBarTitle>
          <ul className={styles.list} aria-label="Safety">
            {briefing.safetyCautions.map((c) => (
              <li key={c}>{c}</li>
            ))}
          </ul>
        </MessageBarBody>
      </MessageBar>
    </>
  );
}

/**
 * An observer's own briefing on the event page, the same as the e-mail: for each of their stations the
 * predicted times with their ±, the ring windows, the window to record, the pointing and the Moon, then
 * the cautions about the prediction and about safety.
 */
export function MyBriefing({ eventId, userId }: { eventId: string; userId: string }) {
  const styles = useStyles();
  const briefing = useBriefing(eventId);
  if (briefing.isPending) return <Loading label="Loading your briefing…" />;
  if (briefing.isError)
    return (
      <RequestFailed what="your briefing" error={briefing.error} onRetry={() => void briefing.refetch()} />
    );
  const b = briefing.data;
  // A coordinator's answer lists every station; "your" briefing is the stations you observe from.
  const own = b.stations.filter((s) => s.observerId === userId);
  return (
    <section className={styles.panel} aria-label="Your briefing">
      <Body1 as="p">
        {b.bodyName}, closest approach {utcAt(b.closestApproachUtc)}, body radius {b.bodyRadiusKm} km.{' '}
        <Link href={b.link}>Link to this event</Link>
      </Body1>
      {b.offsetSource !== null ? (
        <Body1 as="p">
          The predicted path is shifted by the offset the fit of “{b.offsetSource.eventTitle}” (
          {utcAt(b.offsetSource.eventTimeUtc)}) measured, carried {b.offsetSource.carriedDays.toFixed(0)}{' '}
          days.
        </Body1>
      ) : null}
      {own.length === 0 ? (
        <Body1 as="p">
          You observe from no station of this event yet; you may propose your own site below.
        </Body1>
      ) : (
        own.map((s) => <StationBriefing key={s.stationId} station={s} />)
      )}
      <Cautions briefing={b} />
    </section>
  );
}
