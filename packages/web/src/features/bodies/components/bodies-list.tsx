import {
  Body1,
  Button,
  Field,
  Input,
  makeStyles,
  MessageBar,
  MessageBarBody,
  Subtitle2,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  Title3,
  tokens,
} from '@fluentui/react-components';
import { useState, type FormEvent } from 'react';
import { createBodyPayloadSchema, useCreateBody } from '../api/create-body';
import { useBodies } from '../api/get-bodies';
import { FormError } from '@/components/form-error';
import {
  errorMessage,
  fieldErrorsFromApi,
  fieldErrorsFromZod,
  type FieldErrors,
} from '@/components/form-errors';
import { Loading, RequestFailed } from '@/components/request-state';
import { RouterLink } from '@/components/router-link';
import { ScrollArea } from '@/components/scroll-area';
import { paths } from '@/config/paths';
import { ApiError } from '@/lib/api-client';

const useStyles = makeStyles({
  section: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
  form: {
    display: 'flex',
    flexWrap: 'wrap',
    gap: tokens.spacingHorizontalM,
    alignItems: 'start',
    maxWidth: '48em',
  },
  submit: { marginTop: '26px' },
  number: { textAlign: 'end' },
});

/** A coordinator adds a body by name; a taken name is refused on the name field. */
function CreateBodyForm({ teamId }: { teamId: string }) {
  const styles = useStyles();
  const [name, setName] = useState('');
  const [designation, setDesignation] = useState('');
  const [errors, setErrors] = useState<FieldErrors>({});
  const [created, setCreated] = useState<{ id: string; name: string } | null>(null);
  const create = useCreateBody(teamId);

  const submit = (event: FormEvent) => {
    event.preventDefault();
    setCreated(null);
    const parsed = createBodyPayloadSchema.safeParse({
      name,
      ...(designation.trim() === '' ? {} : { designation }),
    });
    if (!parsed.success) {
      setErrors(fieldErrorsFromZod(parsed.error));
      return;
    }
    setErrors({});
    create.mutate(parsed.data, {
      onSuccess: (body) => {
        setCreated({ id: body.id, name: body.name });
        setName('');
        setDesignation('');
      },
      onError: (error) => setErrors(fieldErrorsFromApi(error)),
    });
  };

  const unplaced = create.isError && !(create.error instanceof ApiError && create.error.issues.length > 0);
  return (
    <form className={styles.section} onSubmit={submit} noValidate aria-labelledby="new-body-heading">
      <Subtitle2 as="h3" id="new-body-heading">
        New body
      </Subtitle2>
      <div className={styles.form}>
        <Field label="Name" required validationMessage={errors.name}>
          <Input value={name} onChange={(_, d) => setName(d.value)} />
        </Field>
        <Field
          label="Designation"
          hint="Optional, e.g. a provisional designation"
          validationMessage={errors.designation}
        >
          <Input value={designation} onChange={(_, d) => setDesignation(d.value)} />
        </Field>
        <Button className={styles.submit} type="submit" appearance="primary" disabled={create.isPending}>
          {create.isPending ? 'Adding…' : 'Add body'}
        </Button>
      </div>
      {unplaced ? <FormError title="The body was not added" message={errorMessage(create.error)} /> : null}
      {created !== null ? (
        <MessageBar intent="success">
          <MessageBarBody>
            Added <RouterLink to={paths.body(created.id)}>{created.name}</RouterLink>.
          </MessageBarBody>
        </MessageBar>
      ) : null}
    </form>
  );
}

/** The team's bodies with what is known of each; coordinators add new ones below the table. */
export function BodiesList({
  teamId,
  teamName,
  canCreate,
}: {
  teamId: string;
  teamName: string;
  canCreate: boolean;
}) {
  const styles = useStyles();
  const bodies = useBodies(teamId);
  return (
    <section className={styles.section} aria-labelledby="bodies-heading">
      <Title3 as="h2" id="bodies-heading">
        Bodies of {teamName}
      </Title3>
      {bodies.isPending ? (
        <Loading label="Loading the bodies…" />
      ) : bodies.isError ? (
        <RequestFailed what="the bodies" error={bodies.error} onRetry={() => void bodies.refetch()} />
      ) : bodies.data.length === 0 ? (
        <Body1 as="p">No bodies yet.</Body1>
      ) : (
        <ScrollArea label="Bodies table">
          <Table aria-labelledby="bodies-heading" size="small">
            <TableHeader>
              <TableRow>
                <TableHeaderCell>Name</TableHeaderCell>
                <TableHeaderCell>Designation</TableHeaderCell>
                <TableHeaderCell>Events</TableHeaderCell>
                <TableHeaderCell>Approved fits</TableHeaderCell>
                <TableHeaderCell>Physical parameters</TableHeaderCell>
              </TableRow>
            </TableHeader>
            <TableBody>
              {bodies.data.map((body) => (
                <TableRow key={body.id}>
                  <TableCell>
                    <RouterLink to={paths.body(body.id)}>{body.name}</RouterLink>
                  </TableCell>
                  <TableCell>{body.designation ?? '—'}</TableCell>
                  <TableCell className={styles.number}>{body.eventCount}</TableCell>
                  <TableCell className={styles.number}>{body.approvedFitCount}</TableCell>
                  <TableCell>{body.hasContext ? 'entered' : 'not entered'}</TableCell>
                </TableRow>
              ))}
            </TableBody>
          </Table>
        </ScrollArea>
      )}
      {canCreate ? <CreateBodyForm teamId={teamId} /> : null}
    </section>
  );
}
