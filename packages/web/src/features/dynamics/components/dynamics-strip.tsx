import { makeStyles, tokens } from '@fluentui/react-components';
import { axisBottom, scaleLinear, select } from 'd3';
import { useEffect, useMemo, useRef } from 'react';
import type { ContextResult, RingFit } from '../api/dynamics-schema';
import { stripExtentKm, stripMarks, type StripMark } from './strip-marks';

export interface DynamicsStripProps {
  result: ContextResult;
  bodyRadiusKm: number;
  ringFits: RingFit[];
  widthPx?: number;
}

const MARGIN = { top: 24, right: 24, bottom: 44, left: 24 };
const ROW_PX = 18;
const COLOURS: Record<StripMark['kind'], string> = {
  body: '#57534e',
  roche: '#b91c1c',
  synchronous: '#1d4ed8',
  'spin-orbit': '#0f766e',
  'mean-motion': '#7c3aed',
  ring: '#c2410c',
};

const useStyles = makeStyles({
  svg: {
    display: 'block',
    maxWidth: '100%',
    height: 'auto',
    backgroundColor: '#ffffff',
    border: `1px solid ${tokens.colorNeutralStroke2}`,
  },
});

/**
 * One radial axis from the body's centre: the body as a filled bar, then each computed radius as a
 * tick on its own row with its 1-sigma bar, and the fitted ring radius ± 1σ, so the ring can be read
 * against every limit at once. Marks beyond the strip are named in the accessible label instead.
 */
export function DynamicsStrip({ result, bodyRadiusKm, ringFits, widthPx = 760 }: DynamicsStripProps) {
  const styles = useStyles();
  const svgRef = useRef<SVGSVGElement>(null);
  const marks = useMemo(() => stripMarks(result, bodyRadiusKm, ringFits), [result, bodyRadiusKm, ringFits]);
  const extentKm = useMemo(() => stripExtentKm(marks), [marks]);
  const shown = marks.filter((m) => m.radiusKm <= extentKm);
  const offStrip = marks.filter((m) => m.radiusKm > extentKm);
  const heightPx = MARGIN.top + shown.length * ROW_PX + MARGIN.bottom;

  useEffect(() => {
    const svgElement = svgRef.current;
    if (svgElement === null) return;
    const svg = select(svgElement);
    svg.selectAll('*').remove();
    const innerWidth = widthPx - MARGIN.left - MARGIN.right;
    const innerHeight = shown.length * ROW_PX;
    const x = scaleLinear().domain([0, extentKm]).range([0, innerWidth]);
    const g = svg.append('g').attr('transform', `translate(${MARGIN.left},${MARGIN.top})`);
    g.append('rect')
      .attr('class', 'body')
      .attr('x', 0)
      .attr('y', 0)
      .attr('width', x(bodyRadiusKm))
      .attr('height', innerHeight)
      .attr('fill', COLOURS.body)
      .attr('fill-opacity', 0.15);
    for (const [row, mark] of shown.entries()) {
      const y = row * ROW_PX + ROW_PX / 2;
      const colour = COLOURS[mark.kind];
      const item = g.append('g').attr('class', `mark ${mark.kind}`).attr('data-mark', mark.key);
      item
        .append('line')
        .attr('class', 'guide')
        .attr('x1', x(mark.radiusKm))
        .attr('x2', x(mark.radiusKm))
        .attr('y1', 0)
        .attr('y2', innerHeight)
        .attr('stroke', colour)
        .attr('stroke-opacity', 0.25);
      if (mark.sigmaKm > 0) {
        item
          .append('line')
          .attr('class', 'sigma-bar')
          .attr('x1', x(mark.radiusKm - mark.sigmaKm))
          .attr('x2', x(mark.radiusKm + mark.sigmaKm))
          .attr('y1', y)
          .attr('y2', y)
          .attr('stroke', colour)
          .attr('stroke-width', 2);
      }
      item
        .append('circle')
        .attr('cx', x(mark.radiusKm))
        .attr('cy', y)
        .attr('r', mark.kind === 'ring' ? 5 : 3.5)
        .attr('fill', colour);
      const rightSide = x(mark.radiusKm) < innerWidth * 0.7;
      item
        .append('text')
        .attr('x', x(mark.radiusKm) + (rightSide ? 8 : -8))
        .attr('y', y + 4)
        .attr('text-anchor', rightSide ? 'start' : 'end')
        .attr('font-size', 11)
        .attr('fill', colour)
        .text(mark.label);
    }
    g.append('g').attr('transform', `translate(0,${innerHeight})`).call(axisBottom(x).ticks(8));
    g.append('text')
      .attr('x', innerWidth / 2)
      .attr('y', innerHeight + 36)
      .attr('text-anchor', 'middle')
      .attr('font-size', 12)
      .text('Distance from the body centre (km)');
  }, [shown, extentKm, bodyRadiusKm, widthPx]);

  const ringText = ringFits
    .map(
      (r) =>
        `ring ${r.ring} at ${r.radiusKm.toFixed(0)} ± ${r.radiusKmSigma.toFixed(0)} km, ${r.inRocheFluid.toFixed(2)} fluid Roche limits`,
    )
    .join('; ');
  const label =
    `Dynamics strip: Roche fluid ${result.rocheFluidKm.toFixed(0)} km, rigid ${result.rocheRigidKm.toFixed(0)} km, ` +
    `synchronous ${result.synchronousKm.toFixed(0)} km` +
    (ringText === '' ? '' : `; ${ringText}`) +
    (offStrip.length === 0 ? '' : `; beyond the strip: ${offStrip.map((m) => m.label).join(', ')}`);

  return (
    <svg
      ref={svgRef}
      role="img"
      aria-label={label}
      className={styles.svg}
      viewBox={`0 0 ${widthPx} ${heightPx}`}
      width={widthPx}
      height={heightPx}
    />
  );
}
