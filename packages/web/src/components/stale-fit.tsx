import { Badge, MessageBar, MessageBarBody, MessageBarTitle } from '@fluentui/react-components';

// One wording wherever a fit ran on data the event no longer holds (its `inputMatchesEvent` is false):
// the fit view, the fits list, the review and the exports.
export const STALE_FIT_TITLE = 'Based on older data';
export const STALE_FIT_TEXT =
  'The event changed since this fit ran (its chords, stations, ring events, star, ephemeris or DUT1). Run the fit again before relying on it.';

/** Where a decision is made on a fit (review, figures for a paper): a warning that cannot be missed. */
export function StaleFitWarning() {
  return (
    <MessageBar intent="warning" layout="multiline">
      <MessageBarBody>
        <MessageBarTitle>{STALE_FIT_TITLE}</MessageBarTitle>
        {STALE_FIT_TEXT}
      </MessageBarBody>
    </MessageBar>
  );
}

/** In a list of fits: a badge in words, not colour alone, with the reason on hover. */
export function StaleFitBadge() {
  return (
    <Badge appearance="tint" color="warning" title={STALE_FIT_TEXT}>
      based on older data
    </Badge>
  );
}
