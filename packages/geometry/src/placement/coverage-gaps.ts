// Where a team's chords leave the body (or its rings) uncovered, and where more sites would close the
// widest gaps. Works on the stations' predicted cross-track offsets alone (the prediction's crossTrackKm),
// so it is one dimension: a chord at offset d samples the body's outline where the line at d cuts it.
//
// Criterion: make the largest distance from any offset in the span to its nearest chord as small as
// possible (a minimax covering of an interval; Megiddo & Tamir's "p-centre on a line" in its simplest
// form; from memory). Gaps are independent, so giving the next site to the gap whose worst point is
// farthest from a chord, one site at a time, is optimal for any number of sites: each gap's worst distance
// falls with each site it gets and never depends on the others. Within a gap the sites are then spread
// evenly. A gap between two chords of width w with k sites has its worst point at w / (2(k + 1)); a gap
// that runs to an end of the span at w / (2k + 1) (the first site stands w / (2k + 1) from the edge, so
// no site lands on the limb itself, where a chord would only graze); a span with no chord at all at
// w / (2k). A common shift of the path moves every chord alike and leaves the gaps as they are.

export interface CrossTrackSpan {
  fromKm: number;
  toKm: number;
}

export interface CoverageGap {
  fromKm: number;
  toKm: number;
  widthKm: number;
  /** Which ends are the span's edges rather than chords. */
  openAt: 'none' | 'from' | 'to' | 'both';
}

export interface SuggestedOffset {
  crossTrackKm: number;
  /** The gap (before any suggestion) this offset splits. */
  gap: CoverageGap;
}

export interface OffsetSuggestions {
  gapsBefore: CoverageGap[];
  suggestions: SuggestedOffset[];
  /** The widest interval between neighbouring chords (or a chord and an edge) before and after. */
  largestGapKmBefore: number;
  largestGapKmAfter: number;
  /** The largest distance from any offset of the span to its nearest chord, before and after. */
  worstDistanceKmBefore: number;
  worstDistanceKmAfter: number;
}

function checkSpan(span: CrossTrackSpan): void {
  if (!Number.isFinite(span.fromKm) || !Number.isFinite(span.toKm) || !(span.toKm > span.fromKm))
    throw new RangeError(
      `coverage span must run from a lower to a higher offset, got ${span.fromKm}…${span.toKm}`,
    );
}

/**
 * The intervals of the span that no chord splits, in order. Chords outside the span, or exactly on its
 * edges, split nothing; two chords at one offset count once.
 */
export function coverageGaps(span: CrossTrackSpan, crossTracksKm: readonly number[]): CoverageGap[] {
  checkSpan(span);
  for (const d of crossTracksKm)
    if (!Number.isFinite(d)) throw new RangeError(`a station's cross-track offset is not a number (${d})`);
  const inside = [...new Set(crossTracksKm.filter((d) => d > span.fromKm && d < span.toKm))].sort(
    (a, b) => a - b,
  );
  const bounds = [span.fromKm, ...inside, span.toKm];
  const gaps: CoverageGap[] = [];
  for (let i = 0; i + 1 < bounds.length; i++) {
    const fromKm = bounds[i] as number;
    const toKm = bounds[i + 1] as number;
    const fromEdge = i === 0;
    const toEdge = i + 2 === bounds.length;
    gaps.push({
      fromKm,
      toKm,
      widthKm: toKm - fromKm,
      openAt: fromEdge && toEdge ? 'both' : fromEdge ? 'from' : toEdge ? 'to' : 'none',
    });
  }
  return gaps;
}

/** The largest distance from a point of the gap to its nearest chord once `sites` more are spread in it. */
export function worstDistanceKm(gap: CoverageGap, sites: number): number {
  if (gap.openAt === 'both') return sites === 0 ? Number.POSITIVE_INFINITY : gap.widthKm / (2 * sites);
  if (gap.openAt === 'none') return gap.widthKm / (2 * (sites + 1));
  return gap.widthKm / (2 * sites + 1);
}

/** Offsets of `sites` chords spread in the gap so that its worst distance is worstDistanceKm(). */
function spreadInGap(gap: CoverageGap, sites: number): number[] {
  const h = worstDistanceKm(gap, sites);
  const offsets: number[] = [];
  for (let i = 0; i < sites; i++) {
    if (gap.openAt === 'none') offsets.push(gap.fromKm + (i + 1) * 2 * h);
    else if (gap.openAt === 'to') offsets.push(gap.fromKm + (i + 1) * 2 * h);
    else offsets.push(gap.fromKm + h + i * 2 * h);
  }
  return offsets;
}

/**
 * `sites` more cross-track offsets that make the largest distance from any offset of the span to a chord
 * as small as it can be, given the chords at `crossTracksKm`. Ties go to the gap nearer the path's centre
 * (where a chord measures the most of the body), then to the lower offset.
 */
export function suggestOffsets(
  span: CrossTrackSpan,
  crossTracksKm: readonly number[],
  sites: number,
): OffsetSuggestions {
  if (!Number.isInteger(sites) || sites < 0)
    throw new RangeError(`the number of sites must be a whole number ≥ 0, got ${sites}`);
  const gaps = coverageGaps(span, crossTracksKm);
  const given = gaps.map(() => 0);
  const centre = (gap: CoverageGap) => Math.abs((gap.fromKm + gap.toKm) / 2);
  for (let s = 0; s < sites; s++) {
    let best = 0;
    for (let i = 1; i < gaps.length; i++) {
      const a = worstDistanceKm(gaps[i] as CoverageGap, given[i] as number);
      const b = worstDistanceKm(gaps[best] as CoverageGap, given[best] as number);
      if (a > b || (a === b && centre(gaps[i] as CoverageGap) < centre(gaps[best] as CoverageGap))) best = i;
    }
    given[best] = (given[best] as number) + 1;
  }
  const suggestions = gaps
    .flatMap((gap, i) => spreadInGap(gap, given[i] as number).map((crossTrackKm) => ({ crossTrackKm, gap })))
    .sort((a, b) => a.crossTrackKm - b.crossTrackKm);
  const after = coverageGaps(span, [...crossTracksKm, ...suggestions.map((s) => s.crossTrackKm)]);
  const widest = (list: CoverageGap[]) => Math.max(...list.map((g) => g.widthKm));
  return {
    gapsBefore: gaps,
    suggestions,
    largestGapKmBefore: widest(gaps),
    largestGapKmAfter: widest(after),
    worstDistanceKmBefore: Math.max(...gaps.map((g) => worstDistanceKm(g, 0))),
    worstDistanceKmAfter: Math.max(...gaps.map((g, i) => worstDistanceKm(g, given[i] as number))),
  };
}
