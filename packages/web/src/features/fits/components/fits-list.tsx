import {
  Badge,
  Body1,
  Button,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
} from '@fluentui/react-components';
import { useFits } from '../api/get-fits';
import { REVIEW_LABELS } from './fit-view';
import { Loading, RequestFailed } from '@/components/request-state';
import { ScrollArea } from '@/components/scroll-area';
import { StaleFitBadge } from '@/components/stale-fit';
import { utcText } from '@/lib/utc-text';

export function FitsList({
  eventId,
  selectedFitId,
  onSelect,
}: {
  eventId: string;
  selectedFitId: string | null;
  onSelect: (fitId: string) => void;
}) {
  const fits = useFits(eventId);
  if (fits.isPending) return <Loading label="Loading fits…" />;
  if (fits.isError)
    return <RequestFailed what="the fits" error={fits.error} onRetry={() => void fits.refetch()} />;
  if (fits.data.length === 0) return <Body1 as="p">No fits yet. Choose the options above and run one.</Body1>;
  const newestFirst = [...fits.data].sort((a, b) => b.createdAt.localeCompare(a.createdAt));
  return (
    <ScrollArea label="Fits table">
      <Table aria-label="Fits" size="small">
        <TableHeader>
          <TableRow>
            <TableHeaderCell>Started</TableHeaderCell>
            <TableHeaderCell>Author</TableHeaderCell>
            <TableHeaderCell>State</TableHeaderCell>
            <TableHeaderCell>Review</TableHeaderCell>
            <TableHeaderCell>Data</TableHeaderCell>
            <TableHeaderCell>Open</TableHeaderCell>
          </TableRow>
        </TableHeader>
        <TableBody>
          {newestFirst.map((fit) => {
            const started = utcText(fit.createdAt);
            return (
              <TableRow key={fit.id} aria-selected={fit.id === selectedFitId}>
                <TableCell>{started}</TableCell>
                <TableCell>{fit.createdBy.name}</TableCell>
                <TableCell>{fit.state === 'running' ? `running (${fit.progress} %)` : fit.state}</TableCell>
                <TableCell>
                  <Badge
                    appearance={fit.reviewState === 'approved' ? 'filled' : 'outline'}
                    color={fit.reviewState === 'approved' ? 'success' : 'informative'}
                  >
                    {REVIEW_LABELS[fit.reviewState]}
                  </Badge>
                </TableCell>
                <TableCell>{fit.inputMatchesEvent ? 'current' : <StaleFitBadge />}</TableCell>
                <TableCell>
                  <Button
                    size="small"
                    appearance={fit.id === selectedFitId ? 'primary' : 'secondary'}
                    aria-label={`Open fit of ${started}`}
                    aria-pressed={fit.id === selectedFitId}
                    onClick={() => onSelect(fit.id)}
                  >
                    {fit.id === selectedFitId ? 'Shown' : 'Open'}
                  </Button>
                </TableCell>
              </TableRow>
            );
          })}
        </TableBody>
      </Table>
    </ScrollArea>
  );
}
