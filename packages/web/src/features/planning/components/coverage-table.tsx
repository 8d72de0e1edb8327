import {
  makeStyles,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  tokens,
} from '@fluentui/react-components';
import { STATION_OUTLOOK_LABELS, STATION_STATUS_LABELS, type BriefingStation } from '@limbus/schema/planning';
import { crossTrackText, degText, predictedTimeText, utcAt, windowText } from '../planning-text';
import { ScrollArea } from '@/components/scroll-area';

const useStyles = makeStyles({
  number: { fontFamily: tokens.fontFamilyMonospace, whiteSpace: 'nowrap' },
  list: { margin: 0, paddingLeft: tokens.spacingHorizontalL },
});

const COLUMNS = [
  'Station',
  'Status',
  'Outlook',
  'Cross-track offset (km, ±1σ)',
  'Closest approach (UTC)',
  'Disappearance (UTC, ±1σ)',
  'Reappearance (UTC, ±1σ)',
  'Ring windows (UTC)',
  'Watch window (UTC, 3σ)',
  'Star altitude (°)',
  'Star azimuth (°)',
  'Sun altitude (°)',
  'Moon separation (°)',
  'Moon illuminated (%)',
] as const;

/**
 * Each station's predicted chord: cross-track offset with its 1σ, closest approach, disappearance and
 * reappearance with the ± the path's 1σ implies, ring windows, the watch window that covers 3σ, and the
 * sky at the station (star, Sun, Moon).
 */
export function CoverageTable({ stations }: { stations: readonly BriefingStation[] }) {
  const styles = useStyles();
  const sorted = [...stations].sort((a, b) => b.crossTrackKm - a.crossTrackKm);
  return (
    <ScrollArea label="Coverage table">
      <Table aria-label="Predicted chords" size="small">
        <TableHeader>
          <TableRow>
            {COLUMNS.map((c) => (
              <TableHeaderCell key={c}>{c}</TableHeaderCell>
            ))}
          </TableRow>
        </TableHeader>
        <TableBody>
          {sorted.map((s) => (
            <TableRow key={s.stationId}>
              <TableCell>{s.code}</TableCell>
              <TableCell>{STATION_STATUS_LABELS[s.status]}</TableCell>
              <TableCell>{STATION_OUTLOOK_LABELS[s.outlook]}</TableCell>
              <TableCell className={styles.number}>
                {crossTrackText(s.crossTrackKm, s.sigmaCrossTrackKm)}
              </TableCell>
              <TableCell className={styles.number}>{utcAt(s.closestTimeUtc, 1)}</TableCell>
              <TableCell className={styles.number}>{predictedTimeText(s.disappearance)}</TableCell>
              <TableCell className={styles.number}>{predictedTimeText(s.reappearance)}</TableCell>
              <TableCell className={styles.number}>
                {s.rings.length === 0 ? (
                  '—'
                ) : (
                  <ul className={styles.list}>
                    {s.rings.map((r) => (
                      <li key={r.ring}>
                        {r.ring}: {r.window === null ? 'outside' : windowText(r.window[0], r.window[1])}
                      </li>
                    ))}
                  </ul>
                )}
              </TableCell>
              <TableCell className={styles.number}>{windowText(s.watch.fromUtc, s.watch.toUtc)}</TableCell>
              <TableCell className={styles.number}>{degText(s.pointing.starAltitudeDeg)}</TableCell>
              <TableCell className={styles.number}>{degText(s.pointing.starAzimuthDeg)}</TableCell>
              <TableCell className={styles.number}>{degText(s.pointing.sunAltitudeDeg)}</TableCell>
              <TableCell className={styles.number}>{degText(s.pointing.moonSeparationDeg)}</TableCell>
              <TableCell className={styles.number}>
                {(100 * s.pointing.moonIlluminatedFraction).toFixed(0)} %
              </TableCell>
            </TableRow>
          ))}
        </TableBody>
      </Table>
    </ScrollArea>
  );
}
