import { Body1, makeStyles, tokens } from '@fluentui/react-components';
import type { Solution } from '@limbus/geometry';
import { axisBottom, axisLeft, scaleBand, scaleLinear, select } from 'd3';
import { useEffect, useMemo, useRef } from 'react';
import { plotPalette } from '../palette';

export interface ResidualsPlotProps {
  solution: Solution;
  widthPx?: number;
  heightPx?: number;
}

export interface ResidualPoint {
  key: string;
  station: string;
  event: 'disappearance' | 'reappearance';
  residualKm: number;
  sigmaKm: number | null;
}

const MARGIN = { top: 16, right: 16, bottom: 72, left: 64 };

const useStyles = makeStyles({
  svg: {
    display: 'block',
    maxWidth: '100%',
    height: 'auto',
    backgroundColor: '#ffffff',
    border: `1px solid ${tokens.colorNeutralStroke2}`,
  },
});

/** Residuals in chord order, each with the sigma of its timing as the chord states it in km. */
export function residualPoints(solution: Solution): ResidualPoint[] {
  const sigma = new Map<string, number>();
  for (const chord of solution.chords) {
    for (const p of chord.points) sigma.set(`${chord.station}|${p.event}`, p.sigmaKm);
  }
  return (solution.limb?.radialResidualsKm ?? []).map((r) => {
    const key = `${r.station}|${r.event}`;
    return {
      key,
      station: r.station,
      event: r.event,
      residualKm: r.residualKm,
      sigmaKm: sigma.get(key) ?? null,
    };
  });
}

export function ResidualsPlot({ solution, widthPx = 720, heightPx = 280 }: ResidualsPlotProps) {
  const styles = useStyles();
  const svgRef = useRef<SVGSVGElement>(null);
  const points = useMemo(() => residualPoints(solution), [solution]);

  useEffect(() => {
    const svgElement = svgRef.current;
    if (svgElement === null || points.length === 0) return;
    const svg = select(svgElement);
    svg.selectAll('*').remove();
    const plotW = widthPx - MARGIN.left - MARGIN.right;
    const plotH = heightPx - MARGIN.top - MARGIN.bottom;
    const x = scaleBand<string>()
      .domain(points.map((p) => p.key))
      .range([MARGIN.left, MARGIN.left + plotW])
      .padding(0.4);
    const reachKm = Math.max(...points.map((p) => Math.abs(p.residualKm) + (p.sigmaKm ?? 0)), 0.1) * 1.2;
    const y = scaleLinear()
      .domain([-reachKm, reachKm])
      .range([MARGIN.top + plotH, MARGIN.top])
      .nice();

    svg
      .append('g')
      .attr('class', 'axis axis-endpoint')
      .attr('transform', `translate(0,${MARGIN.top + plotH})`)
      .call(
        axisBottom(x).tickFormat((key) => {
          const [station = key, event] = key.split('|');
          return `${station} ${event === 'disappearance' ? 'D' : 'R'}`;
        }),
      )
      .selectAll('text')
      .attr('transform', 'rotate(-35)')
      .attr('text-anchor', 'end');
    svg
      .append('g')
      .attr('class', 'axis axis-residual')
      .attr('transform', `translate(${MARGIN.left},0)`)
      .call(axisLeft(y).ticks(6));
    svg
      .append('text')
      .attr('transform', `translate(16,${MARGIN.top + plotH / 2}) rotate(-90)`)
      .attr('text-anchor', 'middle')
      .text('Radial residual (km)');
    svg
      .append('line')
      .attr('class', 'zero')
      .attr('x1', MARGIN.left)
      .attr('x2', MARGIN.left + plotW)
      .attr('y1', y(0))
      .attr('y2', y(0))
      .attr('stroke', plotPalette.axis)
      .attr('stroke-dasharray', '3 3');

    const marks = svg
      .append('g')
      .selectAll('g')
      .data(points)
      .join('g')
      .attr('class', 'residual')
      .attr('data-endpoint', (p) => p.key)
      .attr('transform', (p) => `translate(${(x(p.key) ?? 0) + x.bandwidth() / 2},0)`);
    const withSigma = marks.filter((p) => p.sigmaKm !== null);
    withSigma
      .append('line')
      .attr('class', 'error-bar')
      .attr('y1', (p) => y(p.residualKm - (p.sigmaKm ?? 0)))
      .attr('y2', (p) => y(p.residualKm + (p.sigmaKm ?? 0)))
      .attr('stroke', plotPalette.limb)
      .attr('stroke-width', 1.25);
    for (const end of [-1, 1]) {
      withSigma
        .append('line')
        .attr('class', 'error-cap')
        .attr('x1', -4)
        .attr('x2', 4)
        .attr('y1', (p) => y(p.residualKm + end * (p.sigmaKm ?? 0)))
        .attr('y2', (p) => y(p.residualKm + end * (p.sigmaKm ?? 0)))
        .attr('stroke', plotPalette.limb);
    }
    // Disappearances as discs, reappearances as squares: the two ends differ by shape, not by colour alone.
    marks
      .append('path')
      .attr('class', 'residual-marker')
      .attr('d', (p) =>
        p.event === 'disappearance' ? 'M-4,0a4,4 0 1,0 8,0a4,4 0 1,0 -8,0' : 'M-4,-4h8v8h-8Z',
      )
      .attr('transform', (p) => `translate(0,${y(p.residualKm)})`)
      .attr('fill', (p) => (p.event === 'disappearance' ? plotPalette.positiveChord : '#ffffff'))
      .attr('stroke', plotPalette.positiveChord)
      .attr('stroke-width', 1.5);
    marks
      .append('title')
      .text(
        (p) =>
          `${p.station} ${p.event}: ${p.residualKm.toFixed(2)} km${p.sigmaKm === null ? '' : ` ± ${p.sigmaKm.toFixed(2)} km`}`,
      );

    return () => {
      svg.selectAll('*').remove();
    };
  }, [points, widthPx, heightPx]);

  if (points.length === 0) return <Body1 as="p">No limb fit yet, so there are no residuals to plot.</Body1>;
  return (
    <svg
      ref={svgRef}
      className={styles.svg}
      role="img"
      aria-label={`Residuals plot: radial residual of ${points.length} chord endpoints, km, with timing error bars`}
      width={widthPx}
      height={heightPx}
      viewBox={`0 0 ${widthPx} ${heightPx}`}
    />
  );
}
