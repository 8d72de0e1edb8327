import {
  Body1,
  Button,
  makeStyles,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  tokens,
} from '@fluentui/react-components';
import { Fragment, useState } from 'react';
import type { OutboxMessage } from '../api/get-outbox';

const useStyles = makeStyles({
  body: {
    whiteSpace: 'pre-wrap',
    overflowWrap: 'anywhere',
    margin: 0,
    padding: tokens.spacingHorizontalM,
    backgroundColor: tokens.colorNeutralBackground3,
    fontFamily: tokens.fontFamilyMonospace,
  },
  scroll: { overflowX: 'auto' },
});

/** Captured e-mails, newest first. Bodies are shown as plain text: mail HTML is never injected into the page. */
export function OutboxTable({ messages }: { messages: OutboxMessage[] }) {
  const styles = useStyles();
  const [openId, setOpenId] = useState<string | null>(null);
  if (messages.length === 0) return <Body1 as="p">No e-mails captured yet</Body1>;
  const newestFirst = [...messages].reverse();
  return (
    <div className={styles.scroll}>
      <Table aria-label="Captured e-mails">
        <TableHeader>
          <TableRow>
            <TableHeaderCell>Sent</TableHeaderCell>
            <TableHeaderCell>To</TableHeaderCell>
            <TableHeaderCell>Subject</TableHeaderCell>
            <TableHeaderCell>Body</TableHeaderCell>
          </TableRow>
        </TableHeader>
        <TableBody>
          {newestFirst.map((message) => {
            const open = openId === message.id;
            const bodyId = `outbox-body-${message.id}`;
            return (
              <Fragment key={message.id}>
                <TableRow>
                  <TableCell>{new Date(message.date).toLocaleString()}</TableCell>
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
                    <TableCell colSpan={4}>
                      <pre id={bodyId} className={styles.body}>
                        {message.text ?? '(no plain-text part)'}
                      </pre>
                    </TableCell>
                  </TableRow>
                ) : null}
              </Fragment>
            );
          })}
        </TableBody>
      </Table>
    </div>
  );
}
