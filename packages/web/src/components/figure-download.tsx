import { Button, Field, makeStyles, Select, tokens } from '@fluentui/react-components';
import { useMutation } from '@tanstack/react-query';
import { useState } from 'react';
import { FormError } from './form-error';
import { errorMessage } from './form-errors';
import { apiBlob } from '@/lib/api-client';
import { saveFile } from '@/lib/save-file';

const useStyles = makeStyles({
  row: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalM, alignItems: 'flex-end' },
});

/** What the server's figure routes take: format, width and (PNG only) resolution. */
export interface FigureSpec {
  format: 'svg' | 'pdf' | 'png';
  widthMm: number;
  dpi: 300 | 600;
}

/**
 * The query string of a figure route for these options: format, width, the route's own parameters, and
 * the dpi for PNG only.
 */
export function figureQuery(spec: FigureSpec, own: Record<string, string> = {}): URLSearchParams {
  const q = new URLSearchParams({ format: spec.format, widthMm: String(spec.widthMm), ...own });
  if (spec.format === 'png') q.set('dpi', String(spec.dpi));
  return q;
}

const FORMATS = {
  svg: { label: 'SVG', format: 'svg', dpi: 300 },
  pdf: { label: 'PDF', format: 'pdf', dpi: 300 },
  png300: { label: 'PNG, 300 dpi', format: 'png', dpi: 300 },
  png600: { label: 'PNG, 600 dpi', format: 'png', dpi: 600 },
} as const;
type FormatKey = keyof typeof FORMATS;

export interface FigureDownloadProps {
  /** The button's text, which also names what is drawn ("Download comparison figure"). */
  buttonLabel: string;
  /** Where the server renders the figure for these options, and the name to save it under. */
  figure: (spec: FigureSpec) => { url: string; fileName: string };
}

/**
 * A paper figure rendered by the server, single column 88 mm or double 180 mm: the downloaded file is the
 * very file the API serves for the same options.
 */
export function FigureDownload({ buttonLabel, figure }: FigureDownloadProps) {
  const styles = useStyles();
  const [formatKey, setFormatKey] = useState<FormatKey>('pdf');
  const [widthMm, setWidthMm] = useState(180);
  const download = useMutation({
    mutationFn: async (spec: FigureSpec) => {
      const { url, fileName } = figure(spec);
      saveFile(fileName, await apiBlob(url));
    },
  });
  const chosen = FORMATS[formatKey];
  return (
    <div>
      <div className={styles.row}>
        <Field label="Figure format">
          <Select value={formatKey} onChange={(_, d) => setFormatKey(d.value as FormatKey)}>
            {(Object.keys(FORMATS) as FormatKey[]).map((k) => (
              <option key={k} value={k}>
                {FORMATS[k].label}
              </option>
            ))}
          </Select>
        </Field>
        <Field label="Figure width">
          <Select value={String(widthMm)} onChange={(_, d) => setWidthMm(Number(d.value))}>
            <option value="88">Single column, 88 mm</option>
            <option value="180">Double column, 180 mm</option>
          </Select>
        </Field>
        <Button
          onClick={() => download.mutate({ format: chosen.format, dpi: chosen.dpi, widthMm })}
          disabled={download.isPending}
        >
          {buttonLabel}
        </Button>
      </div>
      {download.isError ? (
        <FormError title="The figure could not be downloaded" message={errorMessage(download.error)} />
      ) : null}
    </div>
  );
}
