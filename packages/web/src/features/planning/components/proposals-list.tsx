import {
  Body1,
  Button,
  Field,
  Input,
  makeStyles,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  tokens,
} from '@fluentui/react-components';
import { useState } from 'react';
import { useDecideProposal } from '../api/decide-proposal';
import { ConfirmButton } from '@/components/confirm-button';
import { FormError } from '@/components/form-error';
import { errorMessage } from '@/components/form-errors';
import { ScrollArea } from '@/components/scroll-area';

const useStyles = makeStyles({
  number: { fontFamily: tokens.fontFamilyMonospace, whiteSpace: 'nowrap' },
  actions: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalXS, alignItems: 'flex-end' },
});

export interface ProposedSite {
  id: string;
  code: string;
  latDeg: number;
  lonDeg: number;
  heightM: number;
  observerName: string | null;
  notes: string | null;
}

function ProposalRow({ eventId, site }: { eventId: string; site: ProposedSite }) {
  const styles = useStyles();
  const accept = useDecideProposal(eventId);
  const decline = useDecideProposal(eventId);
  const [reason, setReason] = useState('');
  const who = site.observerName ?? 'the observer';
  return (
    <TableRow>
      <TableCell>{site.code}</TableCell>
      <TableCell>{site.observerName ?? '—'}</TableCell>
      <TableCell className={styles.number}>
        {site.latDeg.toFixed(4)}°, {site.lonDeg.toFixed(4)}°, {site.heightM.toFixed(0)} m
      </TableCell>
      <TableCell>{site.notes ?? '—'}</TableCell>
      <TableCell>
        <div className={styles.actions}>
          <Button
            size="small"
            aria-label={`Accept ${site.code}`}
            disabled={accept.isPending}
            onClick={() =>
              accept.mutate({ stationId: site.id, decision: 'accept', body: { status: 'planned' } })
            }
          >
            Accept as planned
          </Button>
          <Field label={`Reason if declined (${site.code})`} size="small">
            <Input size="small" value={reason} onChange={(_, d) => setReason(d.value)} />
          </Field>
          <ConfirmButton
            text="Decline"
            name={`Decline ${site.code}`}
            title={`Decline the site ${site.code}?`}
            description={`The proposed site of ${who} is removed from the event${reason.trim() === '' ? '' : `, with the reason “${reason.trim()}”`}.`}
            confirmText="Decline"
            cancelText="Keep it"
            pending={decline.isPending}
            error={decline.error}
            onOpen={() => decline.reset()}
            onConfirm={(close) =>
              decline.mutate(
                { stationId: site.id, decision: 'decline', body: { reason: reason.trim() } },
                { onSuccess: close },
              )
            }
          />
        </div>
        {accept.isError ? (
          <FormError title="The site was not accepted" message={errorMessage(accept.error)} />
        ) : null}
      </TableCell>
    </TableRow>
  );
}

/** Sites observers proposed for the event, for a coordinator to accept (as planned) or decline. */
export function ProposalsList({ eventId, sites }: { eventId: string; sites: readonly ProposedSite[] }) {
  if (sites.length === 0) return <Body1 as="p">No site is waiting for a decision.</Body1>;
  return (
    <ScrollArea label="Proposed sites table">
      <Table aria-label="Proposed sites" size="small">
        <TableHeader>
          <TableRow>
            {['Station id', 'Observer', 'Where (lat, lon, height)', 'Notes', 'Decision'].map((h) => (
              <TableHeaderCell key={h}>{h}</TableHeaderCell>
            ))}
          </TableRow>
        </TableHeader>
        <TableBody>
          {sites.map((s) => (
            <ProposalRow key={s.id} eventId={eventId} site={s} />
          ))}
        </TableBody>
      </Table>
    </ScrollArea>
  );
}
