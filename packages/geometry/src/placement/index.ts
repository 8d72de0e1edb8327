// Public face of planning around a prediction: where coverage has gaps and where more sites would close
// them, what each observer needs beside their station's prediction, and the map's bands and ticks.
export { coverageGaps, suggestOffsets, worstDistanceKm } from './coverage-gaps.js';
export type { CoverageGap, CrossTrackSpan, OffsetSuggestions, SuggestedOffset } from './coverage-gaps.js';
export { contactTimeSigma } from './contact-time-sigma.js';
export type { ContactTimeSigma, ContactTimeSigmaInput } from './contact-time-sigma.js';
export { briefStations, MIN_WATCH_HALF_SECONDS, WATCH_SIGMAS } from './station-brief.js';
export type { StationBrief } from './station-brief.js';
export { EARTH_MEAN_RADIUS_KM, greatCircleKm, insideRegion, suggestSites } from './site-search.js';
export type { FoundSite, Region, SiteSearch, SiteSearchRequest, SiteSuggestion } from './site-search.js';
export { BAND_SIGMAS, pathMapExtras } from './path-map.js';
export type { BandEdge, PathMapExtras } from './path-map.js';
export type { Pointing, Site } from './pointing.js';
