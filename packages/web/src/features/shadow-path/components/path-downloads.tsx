import { Button, makeStyles, tokens } from '@fluentui/react-components';
import { useMutation } from '@tanstack/react-query';
import {
  fetchPathFile,
  fetchPredictionDocument,
  mapFigureFileName,
  mapFigureUrl,
  PATH_FILE_FORMATS,
  type PathFileFormat,
} from '../api/path-exports';
import { FigureDownload } from '@/components/figure-download';
import { FormError } from '@/components/form-error';
import { errorMessage } from '@/components/form-errors';
import { saveFile } from '@/lib/save-file';

const useStyles = makeStyles({
  panel: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalS, alignItems: 'start' },
  row: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalS },
});

/**
 * What leaves the page: the path as GeoJSON and KML (for any GIS or globe viewer), the prediction
 * document itself, and the map as the server's SVG, PNG or PDF figure.
 */
export function PathDownloads({ eventId, fileStem }: { eventId: string; fileStem: string }) {
  const styles = useStyles();
  const download = useMutation({
    mutationFn: async (what: PathFileFormat | 'prediction') => {
      if (what === 'prediction')
        saveFile(`${fileStem}.prediction.json`, await fetchPredictionDocument(eventId));
      else
        saveFile(
          `${fileStem}-shadow-path.${PATH_FILE_FORMATS[what].suffix}`,
          await fetchPathFile(eventId, what),
        );
    },
  });
  return (
    <div className={styles.panel}>
      <div className={styles.row}>
        {(Object.keys(PATH_FILE_FORMATS) as PathFileFormat[]).map((format) => (
          <Button key={format} disabled={download.isPending} onClick={() => download.mutate(format)}>
            Download path ({PATH_FILE_FORMATS[format].label})
          </Button>
        ))}
        <Button disabled={download.isPending} onClick={() => download.mutate('prediction')}>
          Download prediction (limbus-prediction/1 JSON)
        </Button>
      </div>
      {download.isError ? (
        <FormError title="The file could not be downloaded" message={errorMessage(download.error)} />
      ) : null}
      <FigureDownload
        buttonLabel="Download map figure"
        figure={(spec) => ({ url: mapFigureUrl(eventId, spec), fileName: mapFigureFileName(fileStem, spec) })}
      />
    </div>
  );
}
