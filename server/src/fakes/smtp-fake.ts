import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';

/**
 * A stand-in for an SMTP relay on loopback, for development, demos and tests: it accepts every
 * message (no TLS, no authentication) and keeps it in memory. A small HTTP listing shows what
 * arrived: `GET /messages` (JSON, oldest first) and `DELETE /messages` (empties the list). A
 * development dependency: the production bundle leaves it out.
 */
export interface ReceivedMail {
  id: number;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
  /** ISO 8601, when the fake received it. */
  receivedAt: string;
}

export interface FakeSmtp {
  /** `smtp://127.0.0.1:PORT`, the value for SMTP_URL. */
  url: string;
  /** `http://127.0.0.1:PORT`, the listing (`/messages`). */
  apiUrl: string;
  messages(): ReceivedMail[];
  stop(): Promise<void>;
}

export interface FakeSmtpOptions {
  /** SMTP port; 0 picks a free one. */
  port?: number;
  /** Listing port; 0 picks a free one. */
  apiPort?: number;
}

const HOST = '127.0.0.1';
/** The fake keeps the newest messages only, so a long-running dev server cannot grow without end. */
const KEEP = 1000;

export async function startFakeSmtp({
  port = 0,
  apiPort = 0,
}: FakeSmtpOptions = {}): Promise<FakeSmtp> {
  const received: ReceivedMail[] = [];
  let nextId = 1;

  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    banner: 'Thalpos local fake SMTP',
    logger: false,
    size: 10 * 1024 * 1024,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((mail) => {
          received.push({
            id: nextId++,
            from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
            to: session.envelope.rcptTo.map((r) => r.address),
            subject: mail.subject ?? '',
            text: mail.text ?? '',
            html: typeof mail.html === 'string' ? mail.html : null,
            receivedAt: new Date().toISOString(),
          });
          if (received.length > KEEP) received.splice(0, received.length - KEEP);
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });
  await new Promise<void>((resolve, reject) => {
    smtp.once('error', reject);
    smtp.listen(port, HOST, () => {
      smtp.off('error', reject);
      resolve();
    });
  });
  // A dropped client connection is not the fake's failure.
  smtp.on('error', () => undefined);

  const api = http.createServer((req, res) => {
    const path = new URL(req.url ?? '/', 'http://fake').pathname;
    if (path !== '/messages') {
      res.writeHead(404, { 'content-type': 'application/json' }).end('{"error":"not found"}');
      return;
    }
    if (req.method === 'GET') {
      res.writeHead(200, { 'content-type': 'application/json' });
      res.end(JSON.stringify({ messages: received }));
    } else if (req.method === 'DELETE') {
      received.length = 0;
      res.writeHead(204).end();
    } else {
      res.writeHead(405, { allow: 'GET, DELETE' }).end();
    }
  });
  await new Promise<void>((resolve) => api.listen(apiPort, HOST, resolve));

  const smtpPort = (smtp.server.address() as AddressInfo).port;
  return {
    url: `smtp://${HOST}:${smtpPort}`,
    apiUrl: `http://${HOST}:${(api.address() as AddressInfo).port}`,
    messages: () => [...received],
    stop: () =>
      new Promise<void>((resolve) => {
        api.closeAllConnections();
        api.close(() => smtp.close(() => resolve()));
      }),
  };
}
