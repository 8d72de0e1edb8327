import {
  Body1,
  Button,
  Checkbox,
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
import {
  NOTICE_KIND_LABELS,
  NOTICE_KINDS,
  noticeSettingsPayloadSchema,
  type NoticeKind,
} from '@limbus/schema/team';
import type { MeView } from '@limbus/schema/views';
import { useState, type FormEvent } from 'react';
import { useUpdateNotices } from '../api/update-notices';
import { FormError } from '@/components/form-error';
import { errorMessage } from '@/components/form-errors';
import { ScrollArea } from '@/components/scroll-area';

const useStyles = makeStyles({
  page: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalXL },
  section: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
  kinds: {
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalXS,
    border: 'none',
    margin: 0,
    padding: 0,
  },
  legend: { padding: 0, marginBottom: tokens.spacingVerticalS },
  save: { alignSelf: 'start' },
});

export interface AccountPageProps {
  me: MeView;
  /** The saved account, as the server answered, so the rest of the page shows what is stored. */
  onSaved: (me: MeView) => void;
}

function NoticeSettings({ me, onSaved }: AccountPageProps) {
  const styles = useStyles();
  const [optOut, setOptOut] = useState<readonly NoticeKind[]>(me.noticeOptOuts);
  const [saved, setSaved] = useState(false);
  const save = useUpdateNotices((next) => {
    setSaved(true);
    onSaved(next);
  });

  function submit(event: FormEvent) {
    event.preventDefault();
    setSaved(false);
    save.mutate(noticeSettingsPayloadSchema.parse({ optOut }));
  }

  return (
    <form className={styles.section} onSubmit={submit} aria-labelledby="notices-heading">
      <Subtitle2 as="h3" id="notices-heading">
        E-mail notices
      </Subtitle2>
      <Body1 as="p">
        Limbus e-mails you when something needs your attention. Untick what you would rather check on the
        site. Invitations and password-reset links are always sent: they are the only way to reach their page.
      </Body1>
      <fieldset className={styles.kinds}>
        <legend className={styles.legend}>Send me an e-mail when</legend>
        {NOTICE_KINDS.map((kind) => (
          <Checkbox
            key={kind}
            label={NOTICE_KIND_LABELS[kind]}
            checked={!optOut.includes(kind)}
            onChange={(_, data) => {
              setSaved(false);
              setOptOut(
                NOTICE_KINDS.filter((k) => (k === kind ? data.checked !== true : optOut.includes(k))),
              );
            }}
          />
        ))}
      </fieldset>
      {save.isError ? (
        <FormError title="The notice settings were not saved" message={errorMessage(save.error)} />
      ) : null}
      {saved ? (
        <MessageBar intent="success" role="status">
          <MessageBarBody>Notice settings saved.</MessageBarBody>
        </MessageBar>
      ) : null}
      <Button className={styles.save} appearance="primary" type="submit" disabled={save.isPending}>
        {save.isPending ? 'Saving…' : 'Save notice settings'}
      </Button>
    </form>
  );
}

/** The signed-in user's name, address, teams with roles, and which e-mail notices they receive. */
export function AccountPage({ me, onSaved }: AccountPageProps) {
  const styles = useStyles();
  return (
    <div className={styles.page}>
      <section className={styles.section} aria-labelledby="account-heading">
        <Title3 as="h2" id="account-heading">
          Your account
        </Title3>
        <Body1 as="p">
          {me.name} · {me.email}
          {me.isAdmin ? ' · site admin' : ''}
        </Body1>
        {me.teams.length === 0 ? (
          <Body1 as="p">
            You are not in a team yet. A team&apos;s coordinator sends you an invitation by e-mail.
          </Body1>
        ) : (
          <ScrollArea label="Teams table">
            <Table aria-label="Your teams">
              <TableHeader>
                <TableRow>
                  <TableHeaderCell>Team</TableHeaderCell>
                  <TableHeaderCell>Your roles</TableHeaderCell>
                </TableRow>
              </TableHeader>
              <TableBody>
                {me.teams.map((team) => (
                  <TableRow key={team.id}>
                    <TableCell>{team.name}</TableCell>
                    <TableCell>{team.roles.join(', ')}</TableCell>
                  </TableRow>
                ))}
              </TableBody>
            </Table>
          </ScrollArea>
        )}
      </section>
      <NoticeSettings me={me} onSaved={onSaved} />
    </div>
  );
}
