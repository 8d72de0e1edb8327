import { makeStyles, tokens } from '@fluentui/react-components';
import {
  STATION_OUTLOOKS,
  STATION_OUTLOOK_LABELS,
  STATION_STATUSES,
  STATION_STATUS_LABELS,
  type PredictionMap,
} from '@limbus/schema/planning';
import type { ReactNode } from 'react';
import { mapPalette } from '../map-palette';
import { outlookLook, outlookSymbolPath, statusDash } from '@/components/station-look';

const useStyles = makeStyles({
  legend: {
    display: 'flex',
    flexWrap: 'wrap',
    gap: `${tokens.spacingVerticalXS} ${tokens.spacingHorizontalL}`,
    margin: 0,
    padding: 0,
    listStyle: 'none',
    fontSize: tokens.fontSizeBase200,
  },
  item: { display: 'flex', alignItems: 'center', gap: tokens.spacingHorizontalXS },
});

function Swatch({ children }: { children: ReactNode }) {
  return (
    <svg width={28} height={16} viewBox="-14 -8 28 16" aria-hidden="true">
      {children}
    </svg>
  );
}

const lineSwatch = (stroke: string, width: number, dash?: string) => (
  <Swatch>
    <line x1={-13} x2={13} y1={0} y2={0} stroke={stroke} strokeWidth={width} strokeDasharray={dash} />
  </Swatch>
);

const areaSwatch = (fill: string, opacity: number) => (
  <Swatch>
    <rect x={-13} y={-6} width={26} height={12} fill={fill} fillOpacity={opacity} />
  </Swatch>
);

/** What every mark of the map means: lines by style, bands and night by shade, stations by shape. */
export function MapLegend({ map }: { map: PredictionMap }) {
  const styles = useStyles();
  const hasRings = map.lines.some((l) => l.ring !== null);
  const sigma = map.sigmaCrossTrackKm.toFixed(1);
  const items: Array<[string, ReactNode]> = [
    ['Central line', lineSwatch(mapPalette.central, 2)],
    ['Limits of the body', lineSwatch(mapPalette.limit, 1.5)],
    ...(hasRings
      ? [['Limits of a ring', lineSwatch(mapPalette.ring, 1.5, '8 3 2 3')] as [string, ReactNode]]
      : []),
    [`1σ band of each limit (± ${sigma} km)`, areaSwatch(mapPalette.band, 0.45)],
    [
      `3σ band of each limit (± ${(3 * map.sigmaCrossTrackKm).toFixed(1)} km)`,
      areaSwatch(mapPalette.band, 0.2),
    ],
    ['Night: Sun below the horizon', areaSwatch(mapPalette.night, 0.18)],
    ['Dark night: Sun more than 12° below', areaSwatch(mapPalette.night, 0.32)],
    [
      'Time along the central line (UTC)',
      <Swatch key="tick">
        <circle r={3} fill="#ffffff" stroke={mapPalette.central} />
      </Swatch>,
    ],
    ...STATION_OUTLOOKS.map((outlook): [string, ReactNode] => {
      const look = outlookLook[outlook];
      return [
        STATION_OUTLOOK_LABELS[outlook],
        <Swatch key={outlook}>
          <path
            d={outlookSymbolPath(outlook, 60)}
            fill={look.fill}
            stroke={look.stroke}
            strokeWidth={look.strokeWidth}
          />
        </Swatch>,
      ];
    }),
    ...STATION_STATUSES.map((status): [string, ReactNode] => [
      `${STATION_STATUS_LABELS[status]} station (outline)`,
      <Swatch key={status}>
        <circle
          r={5}
          fill="#ffffff"
          stroke="#000000"
          strokeWidth={1.25}
          strokeDasharray={statusDash[status] ?? undefined}
        />
      </Swatch>,
    ]),
  ];
  return (
    <ul className={styles.legend} aria-label="Map legend">
      {items.map(([text, swatch]) => (
        <li key={text} className={styles.item}>
          {swatch}
          <span>{text}</span>
        </li>
      ))}
    </ul>
  );
}
