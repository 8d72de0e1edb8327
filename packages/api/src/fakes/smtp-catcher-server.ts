import { randomUUID } from 'node:crypto';
import { appendFile, mkdir, readFile } from 'node:fs/promises';
import { createServer, type IncomingMessage, type ServerResponse } from 'node:http';
import type { AddressInfo, Server as NetServer } from 'node:net';
import { join } from 'node:path';
import { simpleParser, type AddressObject } from 'mailparser';
import { SMTPServer, type SMTPServerAddress } from 'smtp-server';

/** One caught message, as served by `GET /messages` (shared runtime contract). */
export interface CaughtMessage {
  id: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string;
  date: string;
  /** The X-Limbus-Kind header (invitation, password-reset, a notice kind); null for other mail. */
  kind: string | null;
}

/** The header the API sets (MAIL_KIND_HEADER in @limbus/schema); mailparser lower-cases header names. */
const KIND_HEADER = 'x-limbus-kind';

export interface SmtpCatcherOptions {
  /** 0 picks a free port (tests). */
  smtpPort: number;
  httpPort: number;
  /** When set, messages are appended to `<dir>/messages.jsonl` and reloaded on start. */
  dir?: string | undefined;
  host?: string;
}

export interface SmtpCatcher {
  smtpUrl: string;
  httpUrl: string;
  messages(): readonly CaughtMessage[];
  close(): Promise<void>;
}

const MESSAGES_FILE = 'messages.jsonl';

function addressText(address: AddressObject | AddressObject[] | undefined): string {
  if (address === undefined) return '';
  return Array.isArray(address) ? address.map((a) => a.text).join(', ') : address.text;
}

function envelopeAddress(address: SMTPServerAddress | false): string {
  return address === false ? '' : address.address;
}

async function loadMessages(dir: string): Promise<CaughtMessage[]> {
  let content: string;
  try {
    content = await readFile(join(dir, MESSAGES_FILE), 'utf8');
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return [];
    throw error;
  }
  return content
    .split('\n')
    .filter((line) => line.trim() !== '')
    .map((line) => {
      // Lines written before the catcher recorded the kind have none.
      const stored = JSON.parse(line) as Omit<CaughtMessage, 'kind'> & { kind?: string | null };
      return { ...stored, kind: stored.kind ?? null };
    });
}

function kindOf(headers: Map<string, unknown>): string | null {
  const value = headers.get(KIND_HEADER);
  return typeof value === 'string' && value.trim() !== '' ? value.trim() : null;
}

function listen(server: NetServer, start: (ready: () => void) => void): Promise<number> {
  return new Promise((resolve, reject) => {
    const onError = (error: Error): void => reject(error);
    server.once('error', onError);
    start(() => {
      server.off('error', onError);
      resolve((server.address() as AddressInfo).port);
    });
  });
}

function sendJson(res: ServerResponse, status: number, body: unknown): void {
  res.writeHead(status, { 'content-type': 'application/json; charset=utf-8' });
  res.end(JSON.stringify(body));
}

/**
 * A local stand-in for a mail relay: accepts any message over plain SMTP on loopback and shows it
 * over HTTP, so demo users and tests can read invitation and password-reset e-mails.
 */
export async function startSmtpCatcher(options: SmtpCatcherOptions): Promise<SmtpCatcher> {
  const host = options.host ?? '127.0.0.1';
  const dir = options.dir;
  if (dir !== undefined) await mkdir(dir, { recursive: true });
  const messages: CaughtMessage[] = dir === undefined ? [] : await loadMessages(dir);

  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    onAuth(_auth, _session, callback) {
      // Any credentials are accepted: this is a catcher, not a relay.
      callback(null, { user: 'catcher' });
    },
    onData(stream, session, callback) {
      simpleParser(stream)
        .then(async (parsed) => {
          const message: CaughtMessage = {
            id: randomUUID(),
            from: addressText(parsed.from) || envelopeAddress(session.envelope.mailFrom),
            to: session.envelope.rcptTo.map((rcpt) => rcpt.address),
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
            html: parsed.html === false ? '' : (parsed.html ?? ''),
            date: (parsed.date ?? new Date()).toISOString(),
            kind: kindOf(parsed.headers),
          };
          messages.push(message);
          if (dir !== undefined) await appendFile(join(dir, MESSAGES_FILE), `${JSON.stringify(message)}\n`);
          callback();
        })
        .catch((error: unknown) => callback(error instanceof Error ? error : new Error(String(error))));
    },
  });

  const http = createServer((req: IncomingMessage, res: ServerResponse) => {
    const path = (req.url ?? '/').split('?')[0];
    if (path !== '/messages') return sendJson(res, 404, { message: 'Not found' });
    if (req.method === 'GET') return sendJson(res, 200, messages);
    if (req.method === 'DELETE') {
      messages.length = 0;
      const clear =
        dir === undefined ? Promise.resolve() : appendFile(join(dir, MESSAGES_FILE), '', { flag: 'w' });
      clear.then(
        () => {
          res.writeHead(204);
          res.end();
        },
        (error: unknown) => sendJson(res, 500, { message: String(error) }),
      );
      return;
    }
    sendJson(res, 405, { message: 'Method not allowed' });
  });

  const smtpPort = await listen(smtp.server, (ready) => smtp.listen(options.smtpPort, host, ready));
  const httpPort = await listen(http, (ready) => http.listen(options.httpPort, host, ready));

  return {
    smtpUrl: `smtp://${host}:${smtpPort}`,
    httpUrl: `http://${host}:${httpPort}`,
    messages: () => messages,
    close: async () => {
      await new Promise<void>((resolve) => smtp.close(() => resolve()));
      http.closeAllConnections();
      await new Promise<void>((resolve, reject) =>
        http.close((error) => (error ? reject(error) : resolve())),
      );
    },
  };
}
