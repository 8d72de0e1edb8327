import { makeStyles, tokens } from '@fluentui/react-components';
import { STATION_OUTLOOK_LABELS, type StationOutlook, type StationStatus } from '@limbus/schema/planning';
import { scaleLinear } from 'd3';
import { outlookLook, outlookSymbolPath, statusDash } from '@/components/station-look';

export interface CoverageChord {
  code: string;
  status: StationStatus;
  outlook: StationOutlook;
  crossTrackKm: number;
  sigmaCrossTrackKm: number;
}

export interface CoveragePlotProps {
  bodyRadiusKm: number;
  rings: ReadonlyArray<{ ring: string; radiusKm: number }>;
  chords: readonly CoverageChord[];
  sizePx?: number;
}

// A chord's line takes its outlook's colour (white would vanish, so outside chords are grey); its marker
// at the left end has the map's shape and fill, and the dash says planned or proposed, as on the map.
const lineColour = (outlook: StationOutlook) =>
  outlook === 'outside'
    ? '#6b6b6b'
    : outlookLook[outlook].fill === 'none'
      ? '#000000'
      : outlookLook[outlook].fill;
/** The marker's dash, twice as long on a line across the plot. */
const lineDash = (status: StationStatus) =>
  statusDash[status]
    ?.split(' ')
    .map((n) => String(2 * Number(n)))
    .join(' ');

const useStyles = makeStyles({
  svg: {
    display: 'block',
    maxWidth: '100%',
    height: 'auto',
    backgroundColor: '#ffffff',
    border: `1px solid ${tokens.colorNeutralStroke2}`,
  },
});

export function coverageLabel({ bodyRadiusKm, rings, chords }: CoveragePlotProps): string {
  const across = chords.filter((c) => Math.abs(c.crossTrackKm) < bodyRadiusKm).length;
  const ringText =
    rings.length === 0
      ? ''
      : ` and ${rings.length === 1 ? 'ring' : 'rings'} ${rings.map((r) => `${r.ring} (${r.radiusKm} km)`).join(', ')}`;
  return `Coverage on the sky plane: ${chords.length} predicted chord${chords.length === 1 ? '' : 's'}, ${across} across the body of radius ${bodyRadiusKm} km${ringText}`;
}

/**
 * The body's and rings' outlines on the sky plane, the shadow moving left to right, with each station's
 * predicted chord as a line at its cross-track offset (up: left of the motion) and the 1σ of that offset
 * as a shaded strip, so that the gaps between chords show at a glance.
 */
export function CoveragePlot(props: CoveragePlotProps) {
  const { bodyRadiusKm, rings, chords, sizePx = 440 } = props;
  const styles = useStyles();
  const margin = { top: 16, right: 96, bottom: 40, left: 56 };
  const reachKm =
    1.1 *
    Math.max(
      bodyRadiusKm,
      ...rings.map((r) => r.radiusKm),
      ...chords.map((c) => Math.abs(c.crossTrackKm) + c.sigmaCrossTrackKm),
    );
  const plot = sizePx - margin.left - margin.right;
  const x = scaleLinear()
    .domain([-reachKm, reachKm])
    .range([margin.left, margin.left + plot]);
  const y = scaleLinear()
    .domain([-reachKm, reachKm])
    .range([margin.top + plot, margin.top]);
  const height = margin.top + plot + margin.bottom;
  const ticks = y.ticks(6);
  const kmPx = (km: number) => Math.abs(x(km) - x(0));
  return (
    <svg
      className={styles.svg}
      role="img"
      aria-label={coverageLabel(props)}
      width={sizePx}
      height={height}
      viewBox={`0 0 ${sizePx} ${height}`}
    >
      <g aria-hidden="true">
        {ticks.map((t) => (
          <g key={t} transform={`translate(0,${y(t)})`}>
            <line x1={margin.left - 4} x2={margin.left} stroke="#3b4a4f" />
            <text x={margin.left - 6} y={4} textAnchor="end" fontSize={11}>
              {t}
            </text>
          </g>
        ))}
        <line x1={margin.left} x2={margin.left} y1={margin.top} y2={margin.top + plot} stroke="#3b4a4f" />
        <text
          transform={`translate(14,${margin.top + plot / 2}) rotate(-90)`}
          textAnchor="middle"
          fontSize={12}
        >
          Cross-track offset (km), left of the motion up
        </text>
        <text x={margin.left + plot / 2} y={height - 12} textAnchor="middle" fontSize={12}>
          Along the track (km), the shadow moving →
        </text>
      </g>
      {rings.map((r) => (
        <circle
          key={r.ring}
          data-ring={r.ring}
          cx={x(0)}
          cy={y(0)}
          r={kmPx(r.radiusKm)}
          fill="none"
          stroke="#CC79A7"
          strokeWidth={1.5}
          strokeDasharray="8 3 2 3"
        />
      ))}
      <circle
        className="body-outline"
        cx={x(0)}
        cy={y(0)}
        r={kmPx(bodyRadiusKm)}
        fill="#e8eef1"
        stroke="#000000"
        strokeWidth={1.5}
      />
      {chords.map((c) => (
        <g key={c.code} data-chord={c.code} data-outlook={c.outlook}>
          <rect
            x={margin.left}
            width={plot}
            y={y(c.crossTrackKm + c.sigmaCrossTrackKm)}
            height={Math.max(
              0.5,
              y(c.crossTrackKm - c.sigmaCrossTrackKm) - y(c.crossTrackKm + c.sigmaCrossTrackKm),
            )}
            fill={lineColour(c.outlook)}
            fillOpacity={0.08}
          />
          <line
            x1={margin.left}
            x2={margin.left + plot}
            y1={y(c.crossTrackKm)}
            y2={y(c.crossTrackKm)}
            stroke={lineColour(c.outlook)}
            strokeWidth={c.outlook === 'inside' ? 2 : 1.25}
            strokeDasharray={lineDash(c.status)}
          />
          <path
            transform={`translate(${margin.left + 8},${y(c.crossTrackKm)})`}
            d={outlookSymbolPath(c.outlook, 50)}
            fill={outlookLook[c.outlook].fill}
            stroke={outlookLook[c.outlook].stroke}
            strokeWidth={outlookLook[c.outlook].strokeWidth}
            strokeDasharray={statusDash[c.status] ?? undefined}
          />
          <text x={margin.left + plot + 4} y={y(c.crossTrackKm) + 4} fontSize={11}>
            {c.code}
          </text>
          <title>
            {`${c.code} (${c.status}): ${STATION_OUTLOOK_LABELS[c.outlook]}, ${c.crossTrackKm.toFixed(1)} ± ${c.sigmaCrossTrackKm.toFixed(1)} km`}
          </title>
        </g>
      ))}
    </svg>
  );
}
