import {
  Body1,
  Button,
  Dialog,
  DialogBody,
  DialogContent,
  DialogSurface,
  DialogTitle,
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
import { useCreateStation } from '../api/create-station';
import { useDeleteStation } from '../api/delete-station';
import { useTeamMembers, type TeamMember } from '../api/get-team-members';
import { useUpdateStation } from '../api/update-station';
import { StationForm, type StationRow } from './station-form';
import { FormError } from '@/components/form-error';
import { errorMessage, fieldErrorsFromApi } from '@/components/form-errors';
import { ScrollArea } from '@/components/scroll-area';

export type { StationRow } from './station-form';

const useStyles = makeStyles({
  panel: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
  number: { fontFamily: tokens.fontFamilyMonospace, textAlign: 'end' },
  actions: { display: 'flex', gap: tokens.spacingHorizontalXS },
});

/** The observer as the table names them: the member's name, or the typed name of someone without an account. */
function observerText(station: StationRow, members: TeamMember[] | undefined): string {
  if (station.observerId) {
    const member = members?.find((m) => m.userId === station.observerId);
    return member?.name ?? station.observerName ?? 'a team member';
  }
  return station.observerName ? `${station.observerName} (no account)` : '—';
}

const orDash = (value: string | number | null | undefined) => (value == null ? '—' : String(value));

/** A form-level message only when the refusal names no field the form shows. */
function unnamedError(error: unknown): boolean {
  return error !== null && Object.keys(fieldErrorsFromApi(error)).length === 0;
}

function AddStation({ eventId, members }: { eventId: string; members: TeamMember[] | undefined }) {
  const create = useCreateStation(eventId);
  return (
    <>
      <StationForm
        station={null}
        members={members}
        formLabel="Add station"
        submitLabel="Add station"
        pending={create.isPending}
        serverError={create.error}
        onSubmit={(input, reset) => create.mutate(input, { onSuccess: reset })}
      />
      {unnamedError(create.error) ? (
        <FormError title="The station was not added" message={errorMessage(create.error)} />
      ) : null}
    </>
  );
}

function EditStation({
  eventId,
  station,
  members,
  onClose,
}: {
  eventId: string;
  station: StationRow;
  members: TeamMember[] | undefined;
  onClose: () => void;
}) {
  const update = useUpdateStation(eventId);
  return (
    <Dialog open onOpenChange={(_, data) => (data.open ? undefined : onClose())}>
      <DialogSurface>
        <DialogBody>
          <DialogTitle>Edit station {station.code}</DialogTitle>
          <DialogContent>
            <StationForm
              station={station}
              members={members}
              formLabel={`Edit station ${station.code}`}
              submitLabel="Save station"
              pending={update.isPending}
              serverError={update.error}
              onSubmit={(input) => update.mutate({ stationId: station.id, input }, { onSuccess: onClose })}
              onCancel={onClose}
            />
            {unnamedError(update.error) ? (
              <FormError title="The station was not saved" message={errorMessage(update.error)} />
            ) : null}
          </DialogContent>
        </DialogBody>
      </DialogSurface>
    </Dialog>
  );
}

export interface StationsPanelProps {
  eventId: string;
  /** The event's team, whose members may be chosen as observers. */
  teamId: string;
  /** The stations the viewer may see: all of them, or an observer's own. */
  stations: StationRow[];
  /** How many stations the event has, when `stations` holds only the viewer's own. */
  eventStationCount?: number;
  /** Coordinators add, edit and remove stations. */
  canEdit: boolean;
}

function emptyText(eventStationCount: number): string {
  if (eventStationCount === 0) return 'No stations yet.';
  if (eventStationCount === 1)
    return "This event's only station is not assigned to you yet; ask the event's coordinator to assign you one.";
  return `None of this event's ${eventStationCount} stations is assigned to you yet; ask the event's coordinator to assign you one.`;
}

/** The event's stations with their observer and equipment; coordinators add, edit and remove them. */
export function StationsPanel({ eventId, teamId, stations, eventStationCount, canEdit }: StationsPanelProps) {
  const styles = useStyles();
  const remove = useDeleteStation(eventId);
  const members = useTeamMembers(teamId);
  const [editing, setEditing] = useState<StationRow | null>(null);
  // Without the member list a name can still be typed, so a failed load offers an empty list.
  const memberList = members.data ?? (members.isError ? [] : undefined);
  return (
    <section className={styles.panel} aria-label="Stations">
      {stations.length === 0 ? (
        <Body1 as="p">{emptyText(eventStationCount ?? 0)}</Body1>
      ) : (
        <ScrollArea label="Stations table">
          <Table aria-label="Stations" size="small">
            <TableHeader>
              <TableRow>
                <TableHeaderCell>Station</TableHeaderCell>
                <TableHeaderCell>Latitude (°)</TableHeaderCell>
                <TableHeaderCell>Longitude (°E)</TableHeaderCell>
                <TableHeaderCell>Height (m)</TableHeaderCell>
                <TableHeaderCell>Observer</TableHeaderCell>
                <TableHeaderCell>Aperture (mm)</TableHeaderCell>
                <TableHeaderCell>Camera</TableHeaderCell>
                <TableHeaderCell>Exposure (s)</TableHeaderCell>
                <TableHeaderCell>Time source</TableHeaderCell>
                {canEdit ? <TableHeaderCell>Actions</TableHeaderCell> : null}
              </TableRow>
            </TableHeader>
            <TableBody>
              {stations.map((s) => (
                <TableRow key={s.id}>
                  <TableCell>{s.code}</TableCell>
                  <TableCell className={styles.number}>{s.latDeg.toFixed(5)}</TableCell>
                  <TableCell className={styles.number}>{s.lonDeg.toFixed(5)}</TableCell>
                  <TableCell className={styles.number}>{s.heightM.toFixed(0)}</TableCell>
                  <TableCell>{observerText(s, memberList)}</TableCell>
                  <TableCell className={styles.number}>{orDash(s.apertureMm)}</TableCell>
                  <TableCell>{orDash(s.camera)}</TableCell>
                  <TableCell className={styles.number}>{orDash(s.exposureSeconds)}</TableCell>
                  <TableCell>{orDash(s.timeSource)}</TableCell>
                  {canEdit ? (
                    <TableCell>
                      <div className={styles.actions}>
                        <Button
                          size="small"
                          aria-label={`Edit station ${s.code}`}
                          onClick={() => setEditing(s)}
                        >
                          Edit
                        </Button>
                        <Button
                          size="small"
                          aria-label={`Delete station ${s.code}`}
                          disabled={remove.isPending}
                          onClick={() => remove.mutate(s.id)}
                        >
                          Delete
                        </Button>
                      </div>
                    </TableCell>
                  ) : null}
                </TableRow>
              ))}
            </TableBody>
          </Table>
        </ScrollArea>
      )}
      {remove.isError ? (
        <FormError title="The station was not deleted" message={errorMessage(remove.error)} />
      ) : null}
      {members.isError && canEdit ? (
        <FormError
          title="The team's members could not be loaded"
          message={`${errorMessage(members.error)}. An observer without an account can still be typed in.`}
        />
      ) : null}
      {canEdit ? <AddStation eventId={eventId} members={memberList} /> : null}
      {editing !== null ? (
        <EditStation
          key={editing.id}
          eventId={eventId}
          station={editing}
          members={memberList}
          onClose={() => setEditing(null)}
        />
      ) : null}
    </section>
  );
}
