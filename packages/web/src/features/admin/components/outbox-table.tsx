import {
  Body1,
  Button,
  Field,
  Input,
  makeStyles,
  Select,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  Text,
  tokens,
} from '@fluentui/react-components';
import { MAIL_KINDS } from '@limbus/schema/team';
import { Fragment, useMemo, useState } from 'react';
import type { OutboxMessage } from '../api/get-outbox';
import { LinkedText } from './linked-text';
import { ScrollArea } from '@/components/scroll-area';
import { utcText } from '@/lib/utc-text';

const useStyles = makeStyles({
  filters: {
    display: 'flex',
    flexWrap: 'wrap',
    gap: tokens.spacingHorizontalM,
    alignItems: 'flex-end',
    marginBottom: tokens.spacingVerticalM,
  },
  body: {
    whiteSpace: 'pre-wrap',
    overflowWrap: 'anywhere',
    margin: 0,
    padding: tokens.spacingHorizontalM,
    backgroundColor: tokens.colorNeutralBackground3,
    fontFamily: tokens.fontFamilyMonospace,
  },
  time: { whiteSpace: 'nowrap' },
});

const ALL_KINDS = 'all';

/** Newest first by the date each message carries; the catcher's order is not a promise. */
function newestFirst(messages: readonly OutboxMessage[]): OutboxMessage[] {
  return [...messages].sort((a, b) => Date.parse(b.date) - Date.parse(a.date));
}

/**
 * Captured e-mails, newest first, filtered by recipient and kind. Bodies are shown as plain text with
 * their links made real; mail HTML is never injected into the page.
 */
export function OutboxTable({ messages }: { messages: OutboxMessage[] }) {
  const styles = useStyles();
  const [openId, setOpenId] = useState<string | null>(null);
  const [recipient, setRecipient] = useState('');
  const [kind, setKind] = useState<string>(ALL_KINDS);
  const sorted = useMemo(() => newestFirst(messages), [messages]);
  if (messages.length === 0) return <Body1 as="p">No e-mails captured yet</Body1>;

  const needle = recipient.trim().toLowerCase();
  const shown = sorted.filter(
    (m) =>
      (kind === ALL_KINDS || m.kind === kind) &&
      (needle === '' || m.to.some((address) => address.toLowerCase().includes(needle))),
  );
  return (
    <>
      <div className={styles.filters} role="search" aria-label="Filter the outbox">
        <Field label="Recipient">
          <Input
            type="search"
            value={recipient}
            placeholder="part of an address"
            onChange={(_, data) => setRecipient(data.value)}
          />
        </Field>
        <Field label="Kind">
          <Select value={kind} onChange={(_, data) => setKind(data.value)}>
            <option value={ALL_KINDS}>all kinds</option>
            {MAIL_KINDS.map((k) => (
              <option key={k} value={k}>
                {k}
              </option>
            ))}
          </Select>
        </Field>
        <Text role="status">
          {shown.length} of {messages.length} e-mails
        </Text>
      </div>
      {shown.length === 0 ? (
        <Body1 as="p">No captured e-mail matches these filters.</Body1>
      ) : (
        <ScrollArea label="Captured e-mails table">
          <Table aria-label="Captured e-mails">
            <TableHeader>
              <TableRow>
                <TableHeaderCell>Sent (UTC)</TableHeaderCell>
                <TableHeaderCell>Kind</TableHeaderCell>
                <TableHeaderCell>To</TableHeaderCell>
                <TableHeaderCell>Subject</TableHeaderCell>
                <TableHeaderCell>Body</TableHeaderCell>
              </TableRow>
            </TableHeader>
            <TableBody>
              {shown.map((message) => {
                const open = openId === message.id;
                const bodyId = `outbox-body-${message.id}`;
                return (
                  <Fragment key={message.id}>
                    <TableRow>
                      <TableCell className={styles.time}>{utcText(message.date)}</TableCell>
                      <TableCell>{message.kind ?? 'other'}</TableCell>
                      <TableCell>{message.to.join(', ')}</TableCell>
                      <TableCell>{message.subject}</TableCell>
                      <TableCell>
                        <Button
                          size="small"
                          aria-expanded={open}
                          aria-controls={open ? bodyId : undefined}
                          aria-label={`${open ? 'Hide' : 'Show'} body of "${message.subject}"`}
                          onClick={() => setOpenId(open ? null : message.id)}
                        >
                          {open ? 'Hide' : 'Show'}
                        </Button>
                      </TableCell>
                    </TableRow>
                    {open ? (
                      <TableRow>
                        <TableCell colSpan={5}>
                          <pre id={bodyId} className={styles.body}>
                            {message.text === '' ? (
                              '(no plain-text part)'
                            ) : (
                              <LinkedText text={message.text} />
                            )}
                          </pre>
                        </TableCell>
                      </TableRow>
                    ) : null}
                  </Fragment>
                );
              })}
            </TableBody>
          </Table>
        </ScrollArea>
      )}
    </>
  );
}
