import { Button, makeStyles, tokens } from '@fluentui/react-components';
import { useMutation } from '@tanstack/react-query';
import { FormError } from './form-error';
import { errorMessage } from './form-errors';
import { saveFile } from '@/lib/save-file';

const useStyles = makeStyles({
  row: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalS, alignItems: 'center' },
});

export type TableFormat = 'csv' | 'json' | 'tex';

const FORMATS: Array<{ format: TableFormat; label: string }> = [
  { format: 'csv', label: 'CSV' },
  { format: 'json', label: 'JSON' },
  { format: 'tex', label: 'LaTeX' },
];

export interface TableDownloadProps {
  /** Names the table in the buttons' accessible names ("fit table", "shape table"). */
  what: string;
  /** Fetches the table the server writes in that format. */
  fetchTable: (format: TableFormat) => Promise<Blob>;
  fileStem: string;
}

/** Every parameter with its 1σ and unit, as the server writes it, in the three formats a paper needs. */
export function TableDownload({ what, fetchTable, fileStem }: TableDownloadProps) {
  const styles = useStyles();
  const download = useMutation({
    mutationFn: async (format: TableFormat) => saveFile(`${fileStem}.${format}`, await fetchTable(format)),
  });
  return (
    <div>
      <div className={styles.row}>
        <span>Table:</span>
        {FORMATS.map(({ format, label }) => (
          <Button
            key={format}
            aria-label={`Download ${what} as ${label}`}
            onClick={() => download.mutate(format)}
            disabled={download.isPending}
          >
            {label}
          </Button>
        ))}
      </div>
      {download.isError ? (
        <FormError title="The table could not be downloaded" message={errorMessage(download.error)} />
      ) : null}
    </div>
  );
}
