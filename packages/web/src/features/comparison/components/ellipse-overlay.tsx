import { makeStyles, tokens } from '@fluentui/react-components';
import { ellipseOutline } from '@limbus/geometry/ellipse';
import type { LimbEllipse } from '@limbus/geometry';
import type { ComparisonFit } from '../api/get-comparison';
import { fitColour } from '../format';

const SIZE_PX = 360;
const MARGIN_PX = 44;
const POINTS = 120;

const useStyles = makeStyles({
  svg: { width: '100%', maxWidth: `${SIZE_PX}px`, height: 'auto', fontFamily: tokens.fontFamilyBase },
});

interface Shape {
  key: string;
  ellipse: LimbEllipse;
  colour: string;
  ring: boolean;
}

function shapesOf(fits: ComparisonFit[]): Shape[] {
  return fits.flatMap((fit, i) => {
    const colour = fitColour(i);
    const out: Shape[] = [];
    if (fit.limb !== null)
      out.push({
        key: `${fit.fitId}-limb`,
        colour,
        ring: false,
        ellipse: {
          centerFKm: 0,
          centerGKm: 0,
          equatorialRadiusKm: fit.limb.equatorialRadiusKm.value,
          oblateness: fit.limb.oblateness.value,
          positionAngleDeg: fit.limb.positionAngleDeg.value,
        },
      });
    for (const r of fit.rings)
      // A circle of radius R seen at opening angle B: semi-axes R and R·|sin B|, semi-minor at the ring's P.
      out.push({
        key: `${fit.fitId}-ring-${r.ring}`,
        colour,
        ring: true,
        ellipse: {
          centerFKm: 0,
          centerGKm: 0,
          equatorialRadiusKm: r.radiusKm.value,
          oblateness: 1 - Math.abs(Math.sin((r.openingAngleDeg.value * Math.PI) / 180)),
          positionAngleDeg: r.positionAngleDeg.value,
        },
      });
    return out;
  });
}

/** Limb (solid) and ring (dashed) ellipses of every fit, each moved to a common centre; north up, east left. */
export function EllipseOverlay({ fits }: { fits: ComparisonFit[] }) {
  const styles = useStyles();
  const shapes = shapesOf(fits);
  const extentKm = Math.max(1, ...shapes.map((s) => s.ellipse.equatorialRadiusKm)) * 1.1;
  const plot = SIZE_PX - 2 * MARGIN_PX;
  const scale = plot / (2 * extentKm);
  // +f (east) to the left, g (north) up.
  const x = (f: number) => MARGIN_PX + (extentKm - f) * scale;
  const y = (g: number) => MARGIN_PX + (extentKm - g) * scale;
  const limbs = shapes.filter((s) => !s.ring).length;
  const rings = shapes.length - limbs;
  return (
    <svg
      className={styles.svg}
      viewBox={`0 0 ${SIZE_PX} ${SIZE_PX}`}
      role="img"
      aria-label={`Centred overlay of ${limbs} limb and ${rings} ring ellipses`}
    >
      <title>Limb and ring ellipses, centred</title>
      <rect
        x={MARGIN_PX}
        y={MARGIN_PX}
        width={plot}
        height={plot}
        fill="none"
        stroke="#3b4a4f"
        strokeWidth={0.8}
      />
      <line x1={x(0)} x2={x(0)} y1={MARGIN_PX} y2={MARGIN_PX + plot} stroke="#d9e2e4" />
      <line y1={y(0)} y2={y(0)} x1={MARGIN_PX} x2={MARGIN_PX + plot} stroke="#d9e2e4" />
      {shapes.map((s) => (
        <path
          key={s.key}
          data-shape={s.ring ? 'ring' : 'limb'}
          d={
            ellipseOutline(s.ellipse, POINTS)
              .map((p, i) => `${i === 0 ? 'M' : 'L'}${x(p.fKm).toFixed(1)},${y(p.gKm).toFixed(1)}`)
              .join('') + 'Z'
          }
          fill="none"
          stroke={s.colour}
          strokeWidth={1.4}
          strokeDasharray={s.ring ? '6 3' : undefined}
        />
      ))}
      <text x={MARGIN_PX + plot / 2} y={SIZE_PX - 12} textAnchor="middle" fontSize={12}>
        f − f₀ (km), ±{Math.round(extentKm)} km
      </text>
      <text transform={`translate(14,${MARGIN_PX + plot / 2}) rotate(-90)`} textAnchor="middle" fontSize={12}>
        g − g₀ (km)
      </text>
      <text x={MARGIN_PX + plot - 4} y={MARGIN_PX + 14} textAnchor="end" fontSize={11}>
        N up, E left
      </text>
    </svg>
  );
}
