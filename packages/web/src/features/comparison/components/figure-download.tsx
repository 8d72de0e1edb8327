import {
  Button,
  Field,
  makeStyles,
  MessageBar,
  MessageBarBody,
  Select,
  tokens,
} from '@fluentui/react-components';
import { useState } from 'react';
import { type ComparisonFigureInput, useDownloadComparisonFigure } from '../api/download-comparison-figure';
import type { FitSelection } from '../api/get-comparison';
import { errorMessage } from '@/components/form-errors';

const useStyles = makeStyles({
  row: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalM, alignItems: 'flex-end' },
});

const FORMATS = {
  svg: { label: 'SVG', format: 'svg', dpi: 300 },
  pdf: { label: 'PDF', format: 'pdf', dpi: 300 },
  png300: { label: 'PNG, 300 dpi', format: 'png', dpi: 300 },
  png600: { label: 'PNG, 600 dpi', format: 'png', dpi: 600 },
} as const;
type FormatKey = keyof typeof FORMATS;

export interface FigureDownloadProps {
  teamId: string;
  selection: FitSelection;
  jointId: string | null;
}

/** Paper figure of the comparison, rendered by the server: single column 88 mm or double 180 mm. */
export function FigureDownload({ teamId, selection, jointId }: FigureDownloadProps) {
  const styles = useStyles();
  const [formatKey, setFormatKey] = useState<FormatKey>('pdf');
  const [widthMm, setWidthMm] = useState(180);
  const download = useDownloadComparisonFigure(teamId);
  const chosen = FORMATS[formatKey];
  const input: ComparisonFigureInput = {
    format: chosen.format,
    dpi: chosen.dpi,
    widthMm,
    selection,
    jointId,
  };
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
        <Button onClick={() => download.mutate(input)} disabled={download.isPending}>
          Download comparison figure
        </Button>
      </div>
      {download.isError ? (
        <MessageBar intent="error" role="alert">
          <MessageBarBody>{errorMessage(download.error)}</MessageBarBody>
        </MessageBar>
      ) : null}
    </div>
  );
}
