import type { FitStatus } from '@limbus/schema/views';

/**
 * Where a fit stands, in words, review first: a solved fit in review reads "In review", never plain
 * "solved", so nobody takes an unreviewed result for the team's answer.
 */
export function fitStatusText(fit: Pick<FitStatus, 'state' | 'reviewState'> | null): string {
  if (fit === null) return 'No fit yet';
  switch (fit.state) {
    case 'queued':
      return 'Fit queued';
    case 'running':
      return 'Fit running';
    case 'failed':
      return 'Fit failed';
    case 'solved':
      switch (fit.reviewState) {
        case 'in_review':
          return 'Solved, in review';
        case 'approved':
          return 'Solved, approved';
        case 'returned':
          return 'Solved, returned';
        case 'none':
          return 'Solved, not sent for review';
      }
  }
}
