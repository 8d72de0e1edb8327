import { makeStyles, tokens } from '@fluentui/react-components';
import type { LimbEllipse } from '@limbus/geometry';
import { ellipseOutline } from '@limbus/geometry/ellipse';
import { line, scaleLinear } from 'd3';

const CELL_PX = 170;
const MARGIN_PX = 14;
const POINTS = 96;

const useStyles = makeStyles({
  grid: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalM },
  svg: { width: `${CELL_PX}px`, height: 'auto', fontFamily: tokens.fontFamilyBase },
});

type Apparent = Pick<LimbEllipse, 'equatorialRadiusKm' | 'oblateness' | 'positionAngleDeg'>;

export interface SilhouettePair {
  fitId: string;
  title: string;
  observed: Apparent;
  model: Apparent;
}

const centred = (a: Apparent): LimbEllipse => ({ centerFKm: 0, centerGKm: 0, ...a });

/** One small sky-plane cell per event, all at one scale so sizes compare: observed limb solid, model dashed. */
export function Silhouettes({ pairs }: { pairs: SilhouettePair[] }) {
  const styles = useStyles();
  const extentKm =
    Math.max(1, ...pairs.flatMap((p) => [p.observed.equatorialRadiusKm, p.model.equatorialRadiusKm])) * 1.1;
  // North up, east left, as on the sky.
  const x = scaleLinear()
    .domain([extentKm, -extentKm])
    .range([MARGIN_PX, CELL_PX - MARGIN_PX]);
  const y = scaleLinear()
    .domain([extentKm, -extentKm])
    .range([MARGIN_PX, CELL_PX - MARGIN_PX]);
  const path = line<{ fKm: number; gKm: number }>()
    .x((p) => x(p.fKm))
    .y((p) => y(p.gKm));
  const outline = (a: Apparent) => `${path(ellipseOutline(centred(a), POINTS)) ?? ''}Z`;
  return (
    <div className={styles.grid}>
      {pairs.map((p) => (
        <svg
          key={p.fitId}
          className={styles.svg}
          viewBox={`0 0 ${CELL_PX} ${CELL_PX + 16}`}
          role="img"
          aria-label={`Model silhouette against the limb of ${p.title}`}
        >
          <title>{`${p.title}: limb (solid) and model silhouette (dashed), ±${Math.round(extentKm)} km, N up, E left`}</title>
          <rect
            x={MARGIN_PX}
            y={MARGIN_PX}
            width={CELL_PX - 2 * MARGIN_PX}
            height={CELL_PX - 2 * MARGIN_PX}
            fill="none"
            stroke="#d9e2e4"
          />
          <path
            data-shape="observed"
            d={outline(p.observed)}
            fill="none"
            stroke="#0072B2"
            strokeWidth={1.6}
          />
          <path
            data-shape="model"
            d={outline(p.model)}
            fill="none"
            stroke="#D55E00"
            strokeWidth={1.4}
            strokeDasharray="5 3"
          />
          <text x={CELL_PX / 2} y={CELL_PX + 10} textAnchor="middle" fontSize={11}>
            {p.title}
          </text>
        </svg>
      ))}
    </div>
  );
}
