import { Body1, Button, makeStyles, tokens } from '@fluentui/react-components';
import type { Solution } from '@limbus/geometry';

const useStyles = makeStyles({
  panel: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM, alignItems: 'start' },
});

function download(name: string, text: string, type: string) {
  const url = URL.createObjectURL(new Blob([text], { type }));
  const link = document.createElement('a');
  link.href = url;
  link.download = name;
  link.click();
  URL.revokeObjectURL(url);
}

/**
 * What can leave the desk today: the shown fit's solution file, byte for byte as stored. Publication
 * figures (vector plots, tables) belong to the export work and are not offered here yet.
 */
export function FiguresPanel({ solution, fileStem }: { solution: Solution | null; fileStem: string }) {
  const styles = useStyles();
  return (
    <section className={styles.panel} aria-label="Figures">
      <Body1 as="p">
        Publication figures are not available in the desk yet; the sky-plane and residual plots can be viewed
        in their own sections.
      </Body1>
      {solution === null ? (
        <Body1 as="p">Open a solved fit to download its solution.</Body1>
      ) : (
        <Button
          onClick={() =>
            download(
              `${fileStem}.solution.json`,
              `${JSON.stringify(solution, null, 2)}\n`,
              'application/json',
            )
          }
        >
          Download solution (limbus-solution/1 JSON)
        </Button>
      )}
    </section>
  );
}
