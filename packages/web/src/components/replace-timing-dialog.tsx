import {
  Body1,
  Button,
  Dialog,
  DialogActions,
  DialogBody,
  DialogContent,
  DialogSurface,
  DialogTitle,
  makeStyles,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  tokens,
} from '@fluentui/react-components';
import {
  REPLACES_BETTER_TIMING,
  replacesBetterTimingSchema,
  type ReplacesBetterTiming,
} from '@limbus/schema/views';
import { z } from 'zod';
import { ScrollArea } from './scroll-area';
import { chordSourceText, markText } from './timing-text';
import { ApiError } from '@/lib/api-client';

const conflictBodySchema = z.object({
  code: z.literal(REPLACES_BETTER_TIMING),
  detail: replacesBetterTimingSchema,
});

/** What an accept would overwrite, when the server refused it with 409 `replaces-better-timing`. */
export function replacesBetterTimingOf(error: unknown): ReplacesBetterTiming | null {
  if (!(error instanceof ApiError) || error.status !== 409) return null;
  const parsed = conflictBodySchema.safeParse(error.body);
  return parsed.success ? parsed.data.detail : null;
}

const useStyles = makeStyles({
  content: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
  surface: { maxWidth: 'min(760px, 95vw)' },
  // Times with all their decimals are long: the columns take the width they need and wrap when narrow.
  table: { tableLayout: 'auto' },
  time: { fontFamily: tokens.fontFamilyMonospace, overflowWrap: 'anywhere' },
});

/**
 * Asks before an accept overwrites a chord whose times are better than the incoming ones (timed from a
 * light curve, or with a smaller σ): both sets side by side, and the person chooses.
 */
export function ReplaceTimingDialog({
  conflict,
  pending,
  onReplace,
  onKeep,
}: {
  conflict: ReplacesBetterTiming | null;
  pending: boolean;
  onReplace: () => void;
  onKeep: () => void;
}) {
  const styles = useStyles();
  // Mounted only while there is a conflict, and then open: a Fluent dialog opened after mounting
  // closed was left aria-hidden under test (jsdom), and mounting on demand costs nothing.
  if (conflict === null) return null;
  const rows = [
    {
      edge: 'Disappearance (D)',
      current: conflict.current.disappearance,
      incoming: conflict.incoming.disappearance,
    },
    {
      edge: 'Reappearance (R)',
      current: conflict.current.reappearance,
      incoming: conflict.incoming.reappearance,
    },
  ];
  return (
    <Dialog
      open
      modalType="alert"
      onOpenChange={(_, data) => {
        if (!data.open) onKeep();
      }}
    >
      <DialogSurface className={styles.surface}>
        <DialogBody>
          <DialogTitle>Replace the better-timed chord of {conflict.station}?</DialogTitle>
          <DialogContent className={styles.content}>
            <Body1 as="p">
              The chord of station {conflict.station} holds times {chordSourceText(conflict.source)}.
              Accepting would replace them with the incoming times below.
            </Body1>
            <ScrollArea label="Current and incoming times">
              <Table
                className={styles.table}
                aria-label={`Times of the chord of ${conflict.station}`}
                size="small"
              >
                <TableHeader>
                  <TableRow>
                    <TableHeaderCell>Edge</TableHeaderCell>
                    <TableHeaderCell>Current (UTC, 1σ)</TableHeaderCell>
                    <TableHeaderCell>Incoming (UTC, 1σ)</TableHeaderCell>
                  </TableRow>
                </TableHeader>
                <TableBody>
                  {rows.map((r) => (
                    <TableRow key={r.edge}>
                      <TableCell>{r.edge}</TableCell>
                      <TableCell className={styles.time}>{markText(r.current)}</TableCell>
                      <TableCell className={styles.time}>{markText(r.incoming)}</TableCell>
                    </TableRow>
                  ))}
                </TableBody>
              </Table>
            </ScrollArea>
          </DialogContent>
          <DialogActions>
            <Button appearance="primary" disabled={pending} onClick={onKeep}>
              Keep the current times
            </Button>
            <Button disabled={pending} onClick={onReplace}>
              {pending ? 'Replacing…' : 'Replace'}
            </Button>
          </DialogActions>
        </DialogBody>
      </DialogSurface>
    </Dialog>
  );
}
