// Local e-mail catcher: an SMTP server that keeps every message, and a JSON API to read them and
// to hold the reply to a recipient's messages (mail-holds.ts).
// Run: npx tsx docker-free-scripts/fakes/mail-fake.ts   (SMTP_PORT, MAILBOX_PORT, FAKES_STATE_DIR)
import { randomUUID } from 'node:crypto';
import http from 'node:http';
import { simpleParser, type AddressObject, type EmailAddress, type ParsedMail } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import {
  closeHttpServer,
  exitOnSignals,
  isMainModule,
  listenLocal,
  portFromEnv,
  readBody,
  resolveStateDir,
  sendJson,
} from './fake-http';
import { holdSchema, MailHolds } from './mail-holds';
import { MailStore, type StoredMessage } from './mail-store';

export type MailFakeOptions = {
  smtpPort?: number;
  httpPort?: number;
  stateDir?: string;
  cap?: number;
  log?: (line: string) => void;
};

export type MailFake = { smtpPort: number; httpPort: number; close(): Promise<void> };

const MAX_MESSAGE_BYTES = 25 * 1024 * 1024;

function flattenAddresses(field: AddressObject | AddressObject[] | undefined): string[] {
  const objects = field === undefined ? [] : Array.isArray(field) ? field : [field];
  const out: string[] = [];
  const walk = (list: EmailAddress[]) => {
    for (const entry of list) {
      if (entry.address) out.push(entry.address);
      if (entry.group) walk(entry.group);
    }
  };
  for (const object of objects) walk(object.value);
  return out;
}

/** `Name <addr>` without the quotes mailparser's `text` adds, so tests can compare plainly. */
function formatSender(field: AddressObject | undefined): string | null {
  const first = field?.value[0];
  if (!first?.address) return field?.text || null;
  return first.name ? `${first.name} <${first.address}>` : first.address;
}

function toStoredMessage(
  parsed: ParsedMail,
  envelope: { from: string | null; to: string[] },
): StoredMessage {
  const now = new Date().toISOString();
  return {
    id: `msg_${Date.now().toString(36)}${randomUUID().slice(0, 8)}`,
    date: parsed.date ? parsed.date.toISOString() : now,
    receivedAt: now,
    from: formatSender(parsed.from) ?? envelope.from ?? '',
    to: flattenAddresses(parsed.to),
    cc: flattenAddresses(parsed.cc),
    envelope,
    subject: parsed.subject ?? '',
    text: parsed.text ?? '',
    html: typeof parsed.html === 'string' ? parsed.html : null,
    attachments: parsed.attachments.map((a) => ({
      filename: a.filename ?? null,
      contentType: a.contentType,
      size: a.size,
    })),
  };
}

async function addHold(holds: MailHolds, req: http.IncomingMessage, res: http.ServerResponse): Promise<void> {
  let body: unknown;
  try {
    body = JSON.parse(await readBody(req, 10_000));
  } catch {
    return sendJson(res, 400, { error: 'Send a JSON body: { "to": address, "ms"?: 1..600000, "outcome"?: "accept" | "reject" }' });
  }
  const parsed = holdSchema.safeParse(body);
  if (!parsed.success) return sendJson(res, 400, { error: parsed.error.issues.map((i) => `${i.path.join('.') || 'body'}: ${i.message}`).join('; ') });
  return sendJson(res, 201, holds.add(parsed.data));
}

function createMailboxApi(store: MailStore, holds: MailHolds): http.Server {
  return http.createServer((req, res) => {
    const url = new URL(req.url ?? '/', 'http://127.0.0.1');
    const parts = url.pathname.split('/').filter(Boolean);
    const method = req.method ?? 'GET';

    if (url.pathname === '/health' && method === 'GET') {
      return sendJson(res, 200, { ok: true, service: 'mail-fake', messages: store.size });
    }
    if (parts[0] === 'messages' && parts.length === 1) {
      if (method === 'GET') {
        const to = url.searchParams.get('to') ?? undefined;
        return sendJson(res, 200, store.list(to));
      }
      if (method === 'DELETE') return sendJson(res, 200, { deleted: store.clear() });
      return sendJson(res, 405, { error: `Method ${method} is not allowed on /messages` });
    }
    if (parts[0] === 'messages' && parts.length === 2 && method === 'GET') {
      const id = decodeURIComponent(parts[1] ?? '');
      const message = store.get(id);
      if (!message) return sendJson(res, 404, { error: `No message with id "${id}"` });
      return sendJson(res, 200, message);
    }
    if (url.pathname === '/holds') {
      if (method === 'GET') return sendJson(res, 200, holds.list());
      if (method === 'POST') return void addHold(holds, req, res);
      if (method === 'DELETE') return sendJson(res, 200, { released: holds.release(url.searchParams.get('to') ?? undefined) });
      return sendJson(res, 405, { error: `Method ${method} is not allowed on /holds` });
    }
    return sendJson(res, 404, {
      error: `Unknown route ${method} ${url.pathname}`,
      routes: ['GET /health', 'GET /messages[?to=addr]', 'GET /messages/:id', 'DELETE /messages', 'GET /holds', 'POST /holds', 'DELETE /holds[?to=addr]'],
    });
  });
}

export async function startMailFake(options: MailFakeOptions = {}): Promise<MailFake> {
  const log = options.log ?? ((line: string) => console.log(line));
  const store = new MailStore(options.stateDir ?? resolveStateDir('mail'), options.cap, log);
  const holds = new MailHolds();

  const smtp = new SMTPServer({
    secure: false,
    authOptional: true,
    // No TLS and no AUTH: nodemailer connects with { secure: false, ignoreTLS: true }.
    disabledCommands: ['AUTH', 'STARTTLS'],
    size: MAX_MESSAGE_BYTES,
    logger: false,
    closeTimeout: 2000,
    banner: 'Ampwright local mail catcher',
    onData(stream, session, callback) {
      const envelope = {
        from: session.envelope.mailFrom ? session.envelope.mailFrom.address : null,
        to: session.envelope.rcptTo.map((r) => r.address),
      };
      simpleParser(stream)
        .then(async (parsed) => {
          if (stream.sizeExceeded) {
            callback(Object.assign(new Error('Message is too large'), { responseCode: 552 }));
            return;
          }
          // The whole message is in; the reply (and so the acceptance) waits while a recipient is held.
          const outcome = await holds.wait(session.id, envelope.to);
          if (outcome !== 'accept') {
            log(`[mail-fake] not accepted (${outcome}) to=${envelope.to.join(',')} subject="${parsed.subject ?? ''}"`);
            callback(Object.assign(new Error('Try again later'), { responseCode: 451 }));
            return;
          }
          const message = toStoredMessage(parsed, envelope);
          store.add(message);
          log(`[mail-fake] stored ${message.id} to=${envelope.to.join(',')} subject="${message.subject}"`);
          callback();
        })
        .catch((err: unknown) => {
          log(`[mail-fake] could not parse a message: ${String(err)}`);
          callback(Object.assign(new Error('Could not parse the message'), { responseCode: 554 }));
        });
    },
    onClose(session) {
      holds.clientGone(session.id);
    },
  });
  smtp.on('error', (err) => log(`[mail-fake] SMTP error: ${err.message}`));

  const smtpPort = await new Promise<number>((resolve, reject) => {
    const onError = (err: Error) => reject(err);
    smtp.server.once('error', onError);
    smtp.listen(options.smtpPort ?? 2525, '127.0.0.1', () => {
      smtp.server.off('error', onError);
      const address = smtp.server.address();
      resolve(typeof address === 'object' && address ? address.port : (options.smtpPort ?? 2525));
    });
  });

  const api = createMailboxApi(store, holds);
  let httpPort: number;
  try {
    httpPort = await listenLocal(api, options.httpPort ?? 2580);
  } catch (err) {
    await new Promise<void>((resolve) => smtp.close(() => resolve()));
    throw err;
  }

  return {
    smtpPort,
    httpPort,
    async close() {
      holds.release();
      await Promise.all([
        new Promise<void>((resolve) => smtp.close(() => resolve())),
        closeHttpServer(api),
      ]);
    },
  };
}

if (isMainModule(import.meta.url)) {
  const main = async () => {
    const fake = await startMailFake({
      smtpPort: portFromEnv('SMTP_PORT', 2525),
      httpPort: portFromEnv('MAILBOX_PORT', 2580),
      stateDir: resolveStateDir('mail'),
    });
    console.log(
      `[mail-fake] SMTP on 127.0.0.1:${fake.smtpPort}, mailbox API on http://127.0.0.1:${fake.httpPort}/messages`,
    );
    exitOnSignals('mail-fake', () => fake.close());
  };
  main().catch((err: unknown) => {
    console.error(`[mail-fake] could not start: ${err instanceof Error ? err.message : String(err)}`);
    process.exit(1);
  });
}
