import { formatUtc, parseLightCurveCsv, type LightCurveParse } from '@limbus/schema/light-curve-csv';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiBlob } from '@/lib/api-client';

export interface RawLightCurve {
  parse: LightCurveParse;
  /** ISO UTC time of the first sample, the origin of `timesSeconds`. */
  originUtc: string | null;
}

/** The report's uploaded CSV as sent, read with the same parser the server and the timing job use. */
export async function getLightCurve(reportId: string, signal?: AbortSignal): Promise<RawLightCurve> {
  const blob = await apiBlob(`/api/reports/${encodeURIComponent(reportId)}/light-curve`, { signal });
  const parse = parseLightCurveCsv(await blob.text());
  return { parse, originUtc: parse.ok ? formatUtc(parse.curve.origin, 0) : null };
}

/** Keyed by the file's hash, so a replaced file is downloaded again. */
export function lightCurveQueryOptions(eventId: string, reportId: string, sha256: string) {
  return queryOptions({
    queryKey: ['events', eventId, 'reports', reportId, 'light-curve', sha256],
    queryFn: ({ signal }) => getLightCurve(reportId, signal),
    staleTime: Infinity,
  });
}

/** Nothing is fetched for a report without a file (`sha256` null). */
export function useLightCurve(eventId: string, reportId: string, sha256: string | null) {
  return useQuery({ ...lightCurveQueryOptions(eventId, reportId, sha256 ?? ''), enabled: sha256 !== null });
}
