import { Body1, Button, makeStyles, Subtitle2, tokens } from '@fluentui/react-components';
import type { Solution } from '@limbus/geometry';
import { fetchFitTable, fitFigureFileName, fitFigureUrl } from '../api/fit-exports';
import { FigureDownload } from '@/components/figure-download';
import { StaleFitWarning } from '@/components/stale-fit';
import { TableDownload } from '@/components/table-download';
import { saveFile } from '@/lib/save-file';

const useStyles = makeStyles({
  panel: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM, alignItems: 'start' },
});

export interface FiguresPanelProps {
  /** The fit shown in the desk, when it is solved; null otherwise. */
  fitId: string | null;
  solution: Solution | null;
  /** False when the event's data changed since the fit ran: its figure and table would describe old data. */
  inputMatchesEvent: boolean;
  fileStem: string;
}

/**
 * What leaves the desk for a paper: the shown fit's sky-plane figure and parameter table as the server
 * renders them (each with its provenance: fit id, input SHA-256, engine version, seed, approval state), and
 * the solution file byte for byte as stored.
 */
export function FiguresPanel({ fitId, solution, inputMatchesEvent, fileStem }: FiguresPanelProps) {
  const styles = useStyles();
  if (fitId === null || solution === null)
    return (
      <section className={styles.panel} aria-label="Figures">
        <Body1 as="p">Open a solved fit to download its figure, its table and its solution.</Body1>
      </section>
    );
  return (
    <section className={styles.panel} aria-label="Figures">
      {inputMatchesEvent ? null : <StaleFitWarning />}
      <Subtitle2 as="h3">Sky-plane figure</Subtitle2>
      <FigureDownload
        buttonLabel="Download fit figure"
        figure={(spec) => ({ url: fitFigureUrl(fitId, spec), fileName: fitFigureFileName(fileStem, spec) })}
      />
      <Subtitle2 as="h3">Parameters</Subtitle2>
      <TableDownload
        what="fit table"
        fetchTable={(format) => fetchFitTable(fitId, format)}
        fileStem={`${fileStem}-parameters`}
      />
      <Button
        onClick={() =>
          saveFile(
            `${fileStem}.solution.json`,
            new Blob([`${JSON.stringify(solution, null, 2)}\n`], { type: 'application/json' }),
          )
        }
      >
        Download solution (limbus-solution/1 JSON)
      </Button>
    </section>
  );
}
