/**
 * A local fake SMTP server with a web inbox, for the e-mail Plyledger sends
 * (proposals to reviewers, decisions to proposers). Messages are kept in memory
 * and shown at the inbox port; tests read them from GET /api/messages.
 * Nothing is ever delivered anywhere.
 */
import http from 'node:http';
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import { escapeHtml } from '../shared/escape-html.ts';

export interface FakeMessage {
  id: number;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
}

export interface MailFake {
  smtpPort: number;
  inboxUrl: string;
  messages: () => FakeMessage[];
  close: () => Promise<void>;
}

const KEEP_AT_MOST = 1000;

function listen(server: { listen: (port: number, host: string, cb: () => void) => unknown; once: (e: string, cb: (err: NodeJS.ErrnoException) => void) => unknown }, port: number, what: string) {
  return new Promise<void>((resolve, reject) => {
    server.once('error', (err) => reject(err.code === 'EADDRINUSE' ? new Error(`${what}: port ${port} on 127.0.0.1 is taken; stop the other program or choose another port`) : err));
    server.listen(port, '127.0.0.1', () => resolve());
  });
}

function inboxPage(messages: FakeMessage[]): string {
  const rows = messages
    .slice()
    .reverse()
    .map((m) => `<article><h2>${escapeHtml(m.subject)}</h2><p class="meta">${escapeHtml(m.receivedAt)} · from ${escapeHtml(m.from)} · to ${escapeHtml(m.to.join(', '))}</p><pre>${escapeHtml(m.text)}</pre></article>`)
    .join('');
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>Plyledger local inbox</title>
<style>body{font-family:system-ui,sans-serif;max-width:52rem;margin:2rem auto;color:#17302d}article{border:1px solid #cddbd8;border-radius:8px;padding:0.5rem 1rem;margin:1rem 0}
h2{font-size:1.05rem;margin:0.4rem 0}.meta{color:#5c7470;font-size:0.85rem}pre{white-space:pre-wrap;font-family:inherit}</style></head>
<body><h1>Local inbox</h1><p>Mail sent by Plyledger on this machine (${messages.length}). Nothing here was delivered anywhere.</p>${rows || '<p>No mail yet.</p>'}</body></html>`;
}

export async function startMailFake(options: { smtpPort: number; inboxPort: number }): Promise<MailFake> {
  const stored: FakeMessage[] = [];
  let nextId = 1;
  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    logger: false,
    size: 10 * 1024 * 1024,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((mail) => {
          stored.push({
            id: nextId++,
            receivedAt: new Date().toISOString(),
            from: mail.from?.text ?? session.envelope.mailFrom?.toString() ?? '',
            to: session.envelope.rcptTo.map((r) => r.address),
            subject: mail.subject ?? '',
            text: mail.text ?? '',
            html: typeof mail.html === 'string' ? mail.html : null,
          });
          if (stored.length > KEEP_AT_MOST) stored.splice(0, stored.length - KEEP_AT_MOST);
          callback();
        })
        .catch((err) => callback(err));
    },
  });
  const inbox = http.createServer((req, res) => {
    if (req.url === '/api/messages' && req.method === 'GET') {
      res.writeHead(200, { 'content-type': 'application/json' }).end(JSON.stringify(stored));
    } else if (req.url === '/api/messages' && req.method === 'DELETE') {
      stored.length = 0;
      res.writeHead(204).end();
    } else if (req.url === '/' && req.method === 'GET') {
      res.writeHead(200, { 'content-type': 'text/html; charset=utf-8' }).end(inboxPage(stored));
    } else {
      res.writeHead(404, { 'content-type': 'text/plain' }).end('not found');
    }
  });
  await listen(smtp as never, options.smtpPort, 'fake SMTP server');
  await listen(inbox, options.inboxPort, 'local inbox');
  return {
    smtpPort: options.smtpPort,
    inboxUrl: `http://127.0.0.1:${options.inboxPort}`,
    messages: () => stored.slice(),
    close: async () => {
      inbox.closeAllConnections();
      await Promise.all([new Promise<void>((r) => smtp.close(() => r())), new Promise<void>((r) => inbox.close(() => r()))]);
    },
  };
}
