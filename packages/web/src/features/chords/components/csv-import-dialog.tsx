import {
  Body1,
  Button,
  Dialog,
  DialogActions,
  DialogBody,
  DialogContent,
  DialogSurface,
  DialogTitle,
  DialogTrigger,
  Field,
  makeStyles,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  tokens,
} from '@fluentui/react-components';
import { useState } from 'react';
import { csvFileSchema, useCsvImport, useCsvPreview, type CsvPreview } from '../api/import-chords';
import { FormError } from '@/components/form-error';
import { errorMessage } from '@/components/form-errors';

const useStyles = makeStyles({
  content: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
  scroll: { maxHeight: '40vh', overflow: 'auto' },
});

function cellText(value: unknown): string {
  if (value === null || value === undefined) return '';
  if (typeof value === 'object') {
    const mark = value as { time?: unknown; sigmaSeconds?: unknown };
    if (typeof mark.time === 'string') return `${mark.time} ± ${String(mark.sigmaSeconds)} s`;
    return JSON.stringify(value);
  }
  return String(value);
}

function PreviewTable({ rows }: { rows: Array<Record<string, unknown>> }) {
  const styles = useStyles();
  const columns = [...new Set(rows.flatMap((row) => Object.keys(row)))].filter((c) => c !== 'id');
  return (
    <div className={styles.scroll}>
      <Table aria-label="Chords to import" size="small">
        <TableHeader>
          <TableRow>
            <TableHeaderCell>Row</TableHeaderCell>
            {columns.map((c) => (
              <TableHeaderCell key={c}>{c}</TableHeaderCell>
            ))}
          </TableRow>
        </TableHeader>
        <TableBody>
          {rows.map((row, i) => (
            <TableRow key={i}>
              <TableCell>{i + 1}</TableCell>
              {columns.map((c) => (
                <TableCell key={c}>{cellText(row[c])}</TableCell>
              ))}
            </TableRow>
          ))}
        </TableBody>
      </Table>
    </div>
  );
}

/**
 * CSV import in two steps: the server first checks the file without writing (preview), and only a clean
 * preview can be imported. Row numbers are the file's own (the header is row 1), as the server reports them.
 */
export function CsvImportDialog({ eventId }: { eventId: string }) {
  const styles = useStyles();
  const [open, setOpen] = useState(false);
  const [file, setFile] = useState<File | null>(null);
  const [fileError, setFileError] = useState<string | undefined>();
  const [preview, setPreview] = useState<CsvPreview | null>(null);
  const check = useCsvPreview(eventId);
  const write = useCsvImport(eventId);

  const reset = () => {
    setFile(null);
    setFileError(undefined);
    setPreview(null);
    check.reset();
    write.reset();
  };

  const choose = (chosen: File | null) => {
    reset();
    const parsed = csvFileSchema.safeParse(chosen);
    if (!parsed.success) {
      setFileError(parsed.error.issues[0]?.message);
      return;
    }
    setFile(parsed.data);
    check.mutate(parsed.data, { onSuccess: setPreview });
  };

  const importNow = () => {
    if (file === null) return;
    write.mutate(file, {
      onSuccess: (result) => {
        if (result.ok) {
          setOpen(false);
          reset();
        } else setPreview(result);
      },
    });
  };

  return (
    <Dialog
      open={open}
      onOpenChange={(_, data) => {
        setOpen(data.open);
        if (!data.open) reset();
      }}
    >
      <DialogTrigger disableButtonEnhancement>
        <Button>Import CSV…</Button>
      </DialogTrigger>
      <DialogSurface>
        <DialogBody>
          <DialogTitle>Import chords from CSV</DialogTitle>
          <DialogContent className={styles.content}>
            <Body1 as="p">
              Nothing is written until the whole file passes the checks. A header row names the columns, in
              any order: station, type, disappearance_utc, disappearance_sigma_s, reappearance_utc,
              reappearance_sigma_s, start_utc, end_utc, time_offset_s. A positive row may leave both cells of
              one edge empty when the station saw only the other (a single-edge chord).
            </Body1>
            <Field label="CSV file" validationMessage={fileError}>
              {(fieldProps) => (
                <input
                  {...fieldProps}
                  type="file"
                  accept=".csv,text/csv"
                  onChange={(event) => choose(event.currentTarget.files?.[0] ?? null)}
                />
              )}
            </Field>
            {check.isPending ? <Body1 as="p">Checking the file…</Body1> : null}
            {check.isError ? (
              <FormError title="The file could not be checked" message={errorMessage(check.error)} />
            ) : null}
            {write.isError ? (
              <FormError title="The import failed" message={errorMessage(write.error)} />
            ) : null}
            {preview !== null && !preview.ok ? (
              <MessageBar intent="error" role="alert" layout="multiline">
                <MessageBarBody>
                  <MessageBarTitle>
                    {preview.problems.length} problem{preview.problems.length === 1 ? '' : 's'}; nothing was
                    written
                  </MessageBarTitle>
                  <ul aria-label="Row problems">
                    {preview.problems.map((p, i) => (
                      <li key={i}>
                        Row {p.row}
                        {p.column === null ? '' : `, column ${p.column}`}: {p.message}
                      </li>
                    ))}
                  </ul>
                </MessageBarBody>
              </MessageBar>
            ) : null}
            {preview !== null && preview.ok ? (
              preview.rows.length === 0 ? (
                <Body1 as="p">The file holds no chords.</Body1>
              ) : (
                <>
                  <Body1 as="p">
                    {preview.rows.length} chord{preview.rows.length === 1 ? '' : 's'} will be added:
                  </Body1>
                  <PreviewTable rows={preview.rows} />
                </>
              )
            ) : null}
          </DialogContent>
          <DialogActions>
            <DialogTrigger disableButtonEnhancement>
              <Button>Cancel</Button>
            </DialogTrigger>
            <Button
              appearance="primary"
              disabled={preview === null || !preview.ok || preview.rows.length === 0 || write.isPending}
              onClick={importNow}
            >
              {write.isPending ? 'Importing…' : 'Import'}
            </Button>
          </DialogActions>
        </DialogBody>
      </DialogSurface>
    </Dialog>
  );
}
