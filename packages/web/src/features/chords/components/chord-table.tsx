import {
  Badge,
  Body1,
  Button,
  Caption1,
  createTableColumn,
  DataGrid,
  DataGridBody,
  DataGridCell,
  DataGridHeader,
  DataGridHeaderCell,
  DataGridRow,
  Field,
  Input,
  makeStyles,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  Select,
  tokens,
  type TableColumnDefinition,
  useId,
} from '@fluentui/react-components';
import { useState, type ReactNode } from 'react';
import { useDeleteChord } from '../api/delete-chord';
import { useChords, type ChordRow } from '../api/get-chords';
import { useSaveChord } from '../api/save-chord';
import { draftOf, emptyDraft, parseDraft, type ChordDraft, type DraftField } from './chord-draft';
import { FormError } from '@/components/form-error';
import { errorMessage } from '@/components/form-errors';
import { Loading, RequestFailed } from '@/components/request-state';
import { ScrollArea } from '@/components/scroll-area';
import { chordSourceText } from '@/components/timing-text';

const useStyles = makeStyles({
  section: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
  toolbar: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalM, alignItems: 'end' },
  addChord: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalS, alignItems: 'center' },
  time: { fontFamily: tokens.fontFamilyMonospace, whiteSpace: 'nowrap' },
  number: { fontFamily: tokens.fontFamilyMonospace, textAlign: 'end' },
  actions: { display: 'flex', gap: tokens.spacingHorizontalXS },
  timeInput: { minWidth: '15em' },
  numberInput: { width: '6em' },
  oneEdge: { display: 'block', color: tokens.colorNeutralForeground3 },
});

const NEW_ROW_ID = '__new__';

// Full ISO times must fit on one line; the grid would otherwise share the width out equally.
const COLUMN_WIDTHS = {
  station: { minWidth: 110, defaultWidth: 140 },
  type: { minWidth: 90, defaultWidth: 100 },
  from: { minWidth: 230, defaultWidth: 240 },
  fromSigma: { minWidth: 70, defaultWidth: 80 },
  to: { minWidth: 230, defaultWidth: 240 },
  toSigma: { minWidth: 70, defaultWidth: 80 },
  offset: { minWidth: 90, defaultWidth: 110 },
  source: { minWidth: 160, defaultWidth: 200 },
  actions: { minWidth: 150, defaultWidth: 160 },
};

interface GridRow {
  id: string;
  chord: ChordRow | null;
}

export interface ChordTableProps {
  eventId: string;
  /** Station ids of the event, for the station choice when a chord is added or edited. */
  stationCodes: string[];
  /** False for roles that may only read (observers, reviewers). */
  canEdit: boolean;
  /** Opens the CSV import dialog; it lives in its own component so this one stays about the table. */
  importButton?: ReactNode;
}

function fromTime(c: ChordRow): string {
  return (c.type === 'positive' ? c.disappearance?.time : c.start) ?? '';
}
function toTime(c: ChordRow): string {
  return (c.type === 'positive' ? c.reappearance?.time : c.end) ?? '';
}
function sigmaText(mark: { sigmaSeconds: number } | null): string {
  return mark === null ? '—' : mark.sigmaSeconds.toFixed(3);
}
/** The one edge a single-edge positive chord gives ("disappearance" or "reappearance"), else null. */
function singleEdge(c: ChordRow): 'disappearance' | 'reappearance' | null {
  if (c.type !== 'positive') return null;
  if (c.disappearance !== null && c.reappearance === null) return 'disappearance';
  if (c.disappearance === null && c.reappearance !== null) return 'reappearance';
  return null;
}
/** A time cell: a positive chord's edge it does not give reads "not observed", not a blank. */
function timeText(c: ChordRow, time: string): string {
  return time === '' && c.type === 'positive' ? 'not observed' : time;
}

const sourceText = (c: ChordRow | null) => (c?.source == null ? '' : chordSourceText(c.source));

function matches(chord: ChordRow, filter: string): boolean {
  const needle = filter.trim().toLowerCase();
  if (needle === '') return true;
  return [chord.station, chord.type, fromTime(chord), toTime(chord), sourceText(chord)].some((text) =>
    text.toLowerCase().includes(needle),
  );
}

/** The event's chords: sort by any column, filter by text, edit one row at a time with checks before saving. */
export function ChordTable({ eventId, stationCodes, canEdit, importButton }: ChordTableProps) {
  const styles = useStyles();
  const chords = useChords(eventId);
  const save = useSaveChord(eventId);
  const remove = useDeleteChord(eventId);
  const [filter, setFilter] = useState('');
  const [editingId, setEditingId] = useState<string | null>(null);
  const [draft, setDraft] = useState<ChordDraft | null>(null);
  const [errors, setErrors] = useState<Partial<Record<DraftField, string>>>({});
  const addReasonId = useId('add-chord-reason');

  const startEdit = (id: string, next: ChordDraft) => {
    save.reset();
    setErrors({});
    setEditingId(id);
    setDraft(next);
  };
  const stopEdit = () => {
    setEditingId(null);
    setDraft(null);
    setErrors({});
  };
  const set = (field: DraftField, value: string) =>
    setDraft((d) => (d === null ? d : { ...d, [field]: value }));

  const commit = () => {
    if (draft === null || editingId === null) return;
    const result = parseDraft(draft);
    if (!result.ok) {
      setErrors(result.errors);
      return;
    }
    setErrors({});
    save.mutate(
      { chordId: editingId === NEW_ROW_ID ? null : editingId, input: result.input },
      { onSuccess: stopEdit },
    );
  };

  // Rebuilt every render: the cells close over the row being edited, and 200 rows cost nothing here.
  const columns = ((): TableColumnDefinition<GridRow>[] => {
    const editing = (row: GridRow) => row.id === editingId && draft !== null;
    const label = (row: GridRow, what: string) => `${what}, ${row.chord?.station ?? 'new chord'}`;
    const textInput = (row: GridRow, field: DraftField, what: string, className: string) => (
      <Input
        className={className}
        aria-label={label(row, what)}
        aria-invalid={errors[field] !== undefined}
        value={draft?.[field] ?? ''}
        onChange={(_, data) => set(field, data.value)}
        onKeyDown={(event) => {
          // The grid moves between cells with arrow keys; inside an input they must move the caret.
          event.stopPropagation();
          if (event.key === 'Enter') commit();
          if (event.key === 'Escape') stopEdit();
        }}
      />
    );
    return [
      createTableColumn<GridRow>({
        columnId: 'station',
        compare: (a, b) => (a.chord?.station ?? '').localeCompare(b.chord?.station ?? ''),
        renderHeaderCell: () => 'Station',
        renderCell: (row) =>
          editing(row) ? (
            <Select
              aria-label={label(row, 'Station')}
              aria-invalid={errors.station !== undefined}
              value={draft?.station ?? ''}
              onChange={(_, data) => set('station', data.value)}
            >
              <option value="">Choose…</option>
              {stationCodes.map((code) => (
                <option key={code}>{code}</option>
              ))}
            </Select>
          ) : (
            row.chord?.station
          ),
      }),
      createTableColumn<GridRow>({
        columnId: 'type',
        compare: (a, b) => (a.chord?.type ?? '').localeCompare(b.chord?.type ?? ''),
        renderHeaderCell: () => 'Type',
        renderCell: (row) =>
          editing(row) ? (
            <Select
              aria-label={label(row, 'Type')}
              value={draft?.type ?? 'positive'}
              onChange={(_, data) => set('type', data.value)}
            >
              <option value="positive">positive</option>
              <option value="negative">negative</option>
            </Select>
          ) : row.chord === null ? null : (
            <>
              {/* Shape and word as well as colour: a filled badge for positive, an outlined one for negative. */}
              <Badge appearance={row.chord.type === 'positive' ? 'filled' : 'outline'} color="informative">
                {row.chord.type}
              </Badge>
              {singleEdge(row.chord) ? (
                <Caption1 className={styles.oneEdge}>one edge ({singleEdge(row.chord)} only)</Caption1>
              ) : null}
            </>
          ),
      }),
      createTableColumn<GridRow>({
        columnId: 'from',
        compare: (a, b) => (a.chord ? fromTime(a.chord) : '').localeCompare(b.chord ? fromTime(b.chord) : ''),
        renderHeaderCell: () => 'Disappearance / watch start (UTC)',
        renderCell: (row) =>
          editing(row) ? (
            textInput(
              row,
              'from',
              draft?.type === 'negative' ? 'Watch start' : 'Disappearance',
              styles.timeInput,
            )
          ) : (
            <span className={styles.time}>{row.chord ? timeText(row.chord, fromTime(row.chord)) : ''}</span>
          ),
      }),
      createTableColumn<GridRow>({
        columnId: 'fromSigma',
        compare: (a, b) =>
          (a.chord?.disappearance?.sigmaSeconds ?? 0) - (b.chord?.disappearance?.sigmaSeconds ?? 0),
        renderHeaderCell: () => 'σ D (s)',
        renderCell: (row) =>
          editing(row) && draft?.type === 'positive' ? (
            textInput(row, 'fromSigma', 'Disappearance σ (s)', styles.numberInput)
          ) : (
            <span className={styles.number}>{row.chord ? sigmaText(row.chord.disappearance) : ''}</span>
          ),
      }),
      createTableColumn<GridRow>({
        columnId: 'to',
        compare: (a, b) => (a.chord ? toTime(a.chord) : '').localeCompare(b.chord ? toTime(b.chord) : ''),
        renderHeaderCell: () => 'Reappearance / watch end (UTC)',
        renderCell: (row) =>
          editing(row) ? (
            textInput(row, 'to', draft?.type === 'negative' ? 'Watch end' : 'Reappearance', styles.timeInput)
          ) : (
            <span className={styles.time}>{row.chord ? timeText(row.chord, toTime(row.chord)) : ''}</span>
          ),
      }),
      createTableColumn<GridRow>({
        columnId: 'toSigma',
        compare: (a, b) =>
          (a.chord?.reappearance?.sigmaSeconds ?? 0) - (b.chord?.reappearance?.sigmaSeconds ?? 0),
        renderHeaderCell: () => 'σ R (s)',
        renderCell: (row) =>
          editing(row) && draft?.type === 'positive' ? (
            textInput(row, 'toSigma', 'Reappearance σ (s)', styles.numberInput)
          ) : (
            <span className={styles.number}>{row.chord ? sigmaText(row.chord.reappearance) : ''}</span>
          ),
      }),
      createTableColumn<GridRow>({
        columnId: 'offset',
        compare: (a, b) => (a.chord?.timeOffsetSeconds ?? 0) - (b.chord?.timeOffsetSeconds ?? 0),
        renderHeaderCell: () => 'Time offset (s)',
        renderCell: (row) =>
          editing(row) ? (
            textInput(row, 'offset', 'Time offset (s)', styles.numberInput)
          ) : (
            <span className={styles.number}>{row.chord?.timeOffsetSeconds.toFixed(3)}</span>
          ),
      }),
      createTableColumn<GridRow>({
        columnId: 'source',
        compare: (a, b) => sourceText(a.chord).localeCompare(sourceText(b.chord)),
        renderHeaderCell: () => 'Times from',
        renderCell: (row) => (editing(row) ? null : sourceText(row.chord)),
      }),
      createTableColumn<GridRow>({
        columnId: 'actions',
        renderHeaderCell: () => 'Actions',
        renderCell: (row) => {
          if (!canEdit) return null;
          const name = row.chord?.station ?? 'new chord';
          if (editing(row))
            return (
              <div className={styles.actions}>
                <Button size="small" appearance="primary" onClick={commit} disabled={save.isPending}>
                  {save.isPending ? 'Saving…' : 'Save'}
                </Button>
                <Button size="small" onClick={stopEdit}>
                  Cancel
                </Button>
              </div>
            );
          if (row.chord === null) return null;
          const chord = row.chord;
          return (
            <div className={styles.actions}>
              <Button
                size="small"
                aria-label={`Edit chord of ${name}`}
                disabled={editingId !== null}
                onClick={() => startEdit(chord.id, draftOf(chord))}
              >
                Edit
              </Button>
              <Button
                size="small"
                aria-label={`Delete chord of ${name}`}
                disabled={editingId !== null || remove.isPending}
                onClick={() => remove.mutate(chord.id)}
              >
                Delete
              </Button>
            </div>
          );
        },
      }),
    ];
  })();

  if (chords.isPending) return <Loading label="Loading chords…" />;
  if (chords.isError)
    return <RequestFailed what="the chords" error={chords.error} onRetry={() => void chords.refetch()} />;

  const shown: GridRow[] = chords.data.filter((c) => matches(c, filter)).map((c) => ({ id: c.id, chord: c }));
  const rows = editingId === NEW_ROW_ID ? [{ id: NEW_ROW_ID, chord: null }, ...shown] : shown;
  const problems = Object.entries(errors);
  // "Add chord" stays in view when it cannot be used, saying why, so nobody hunts for a missing button.
  const addChordReason = !canEdit
    ? 'Only coordinators and modellers add chords'
    : stationCodes.length === 0
      ? 'Add a station first (Stations & reports)'
      : editingId !== null
        ? 'Save or cancel the chord being edited first'
        : null;

  return (
    <section className={styles.section} aria-label="Chords">
      <div className={styles.toolbar}>
        <Field label="Filter chords">
          <Input
            value={filter}
            onChange={(_, data) => setFilter(data.value)}
            placeholder="station, type or time"
          />
        </Field>
        <div className={styles.addChord}>
          <Button
            disabledFocusable={addChordReason !== null}
            aria-describedby={addChordReason === null ? undefined : addReasonId}
            onClick={() => startEdit(NEW_ROW_ID, emptyDraft(stationCodes[0] ?? ''))}
          >
            Add chord
          </Button>
          {addChordReason === null ? null : <Caption1 id={addReasonId}>{addChordReason}</Caption1>}
        </div>
        {canEdit ? importButton : null}
      </div>
      {draft?.type === 'positive' ? (
        <Caption1>
          A station that saw only one edge (a camera started late, a cloud) gives a single-edge chord: leave
          the other edge&apos;s time and σ empty.
        </Caption1>
      ) : null}
      {problems.length > 0 ? (
        <MessageBar intent="error" role="alert" layout="multiline">
          <MessageBarBody>
            <MessageBarTitle>The chord was not saved</MessageBarTitle>
            <ul>
              {problems.map(([field, message]) => (
                <li key={field}>{message}</li>
              ))}
            </ul>
          </MessageBarBody>
        </MessageBar>
      ) : null}
      {save.isError ? (
        <FormError title="The server refused the chord" message={errorMessage(save.error)} />
      ) : null}
      {remove.isError ? (
        <FormError title="The chord was not deleted" message={errorMessage(remove.error)} />
      ) : null}
      {chords.data.length === 0 && editingId === null ? (
        <Body1 as="p">No chords yet. Add one, import a CSV file, or accept an observer&apos;s report.</Body1>
      ) : (
        <ScrollArea label="Chords table">
          <DataGrid
            aria-label="Chord table"
            items={rows}
            columns={columns}
            sortable
            getRowId={(row: GridRow) => row.id}
            focusMode="composite"
            resizableColumns
            columnSizingOptions={COLUMN_WIDTHS}
          >
            <DataGridHeader>
              <DataGridRow>
                {({ renderHeaderCell }) => <DataGridHeaderCell>{renderHeaderCell()}</DataGridHeaderCell>}
              </DataGridRow>
            </DataGridHeader>
            <DataGridBody<GridRow>>
              {({ item, rowId }) => (
                <DataGridRow<GridRow> key={rowId} data-chord-row={item.chord?.station ?? 'new'}>
                  {({ renderCell }) => <DataGridCell>{renderCell(item)}</DataGridCell>}
                </DataGridRow>
              )}
            </DataGridBody>
          </DataGrid>
        </ScrollArea>
      )}
      {filter !== '' && shown.length === 0 && chords.data.length > 0 ? (
        <Body1 as="p">No chord matches “{filter}”.</Body1>
      ) : null}
    </section>
  );
}
