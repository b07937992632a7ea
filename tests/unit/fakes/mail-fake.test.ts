import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import nodemailer from 'nodemailer';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { startMailFake, type MailFake } from '@/docker-free-scripts/fakes/mail-fake';
import type { StoredMessage } from '@/docker-free-scripts/fakes/mail-store';

const quiet = () => undefined;
let stateDir: string;
let fake: MailFake | undefined;

beforeEach(() => {
  stateDir = fs.mkdtempSync(path.join(os.tmpdir(), 'mail-fake-'));
});

afterEach(async () => {
  await fake?.close();
  fake = undefined;
  fs.rmSync(stateDir, { recursive: true, force: true });
});

async function start(cap?: number) {
  fake = await startMailFake({ smtpPort: 0, httpPort: 0, stateDir, cap, log: quiet });
  return fake;
}

// The transport settings the app uses (STACK.md, "Hosted-service fakes").
function transport(port: number) {
  return nodemailer.createTransport({ host: '127.0.0.1', port, secure: false, ignoreTLS: true });
}

async function api<T>(port: number, pathname: string, method = 'GET', body?: unknown): Promise<{ status: number; body: T }> {
  const res = await fetch(`http://127.0.0.1:${port}${pathname}`, { method, body: body === undefined ? undefined : JSON.stringify(body) });
  return { status: res.status, body: (await res.json()) as T };
}

type HoldRow = { to: string; waiting: number };

async function untilWaiting(port: number, to: string): Promise<void> {
  const end = Date.now() + 5000;
  while (Date.now() < end) {
    const { body } = await api<HoldRow[]>(port, '/holds');
    if (body.some((h) => h.to === to && h.waiting > 0)) return;
    await new Promise((r) => setTimeout(r, 20));
  }
  throw new Error(`no message held for ${to}`);
}

const subjects = async (port: number) => (await api<StoredMessage[]>(port, '/messages')).body.map((m) => m.subject);

const CSV = 'lot,thickness_um\n7,8.2\n';

describe('mail fake', () => {
  it('keeps a message sent with nodemailer, attachment included', async () => {
    const { smtpPort, httpPort } = await start();
    await transport(smtpPort).sendMail({
      from: 'Ampwright <no-reply@ampwright.test>',
      to: 'buyer@customer.test',
      subject: 'Certificate of conformance for lot 7',
      text: 'Your certificate is attached.',
      html: '<p>Your certificate is attached.</p>',
      attachments: [{ filename: 'lot-7.csv', content: CSV, contentType: 'text/csv' }],
    });

    const { status, body } = await api<StoredMessage[]>(httpPort, '/messages');
    expect(status).toBe(200);
    expect(body).toHaveLength(1);
    const [message] = body;
    expect(message).toMatchObject({
      from: 'Ampwright <no-reply@ampwright.test>',
      to: ['buyer@customer.test'],
      subject: 'Certificate of conformance for lot 7',
      html: '<p>Your certificate is attached.</p>',
    });
    expect(message?.text.trim()).toBe('Your certificate is attached.');
    expect(message?.attachments).toEqual([
      { filename: 'lot-7.csv', contentType: 'text/csv', size: Buffer.byteLength(CSV) },
    ]);
    expect(Number.isNaN(Date.parse(message?.date ?? ''))).toBe(false);

    const one = await api<StoredMessage>(httpPort, `/messages/${message?.id}`);
    expect(one.status).toBe(200);
    expect(one.body.subject).toBe('Certificate of conformance for lot 7');
  });

  it('lists newest first and filters by recipient, including Bcc', async () => {
    const { smtpPort, httpPort } = await start();
    const mail = transport(smtpPort);
    await mail.sendMail({ from: 'a@ampwright.test', to: 'first@customer.test', subject: 'one', text: '1' });
    await mail.sendMail({ from: 'a@ampwright.test', to: 'second@customer.test', subject: 'two', text: '2' });
    await mail.sendMail({
      from: 'a@ampwright.test',
      to: 'second@customer.test',
      bcc: 'auditor@shop.test',
      subject: 'three',
      text: '3',
    });

    const all = await api<StoredMessage[]>(httpPort, '/messages');
    expect(all.body.map((m) => m.subject)).toEqual(['three', 'two', 'one']);
    const second = await api<StoredMessage[]>(httpPort, '/messages?to=SECOND@customer.test');
    expect(second.body.map((m) => m.subject)).toEqual(['three', 'two']);
    const bcc = await api<StoredMessage[]>(httpPort, '/messages?to=auditor@shop.test');
    expect(bcc.body.map((m) => m.subject)).toEqual(['three']);
    const nobody = await api<StoredMessage[]>(httpPort, '/messages?to=nobody@customer.test');
    expect(nobody.body).toEqual([]);
  });

  it('keeps messages across a restart, and DELETE clears them for good', async () => {
    const first = await start();
    await transport(first.smtpPort).sendMail({ from: 'a@ampwright.test', to: 'b@c.test', subject: 'kept', text: 'x' });
    await first.close();

    const second = await start();
    const after = await api<StoredMessage[]>(second.httpPort, '/messages');
    expect(after.body.map((m) => m.subject)).toEqual(['kept']);
    const cleared = await api<{ deleted: number }>(second.httpPort, '/messages', 'DELETE');
    expect(cleared.body.deleted).toBe(1);
    await second.close();

    const third = await start();
    expect((await api<StoredMessage[]>(third.httpPort, '/messages')).body).toEqual([]);
  });

  it('keeps only the newest messages past the cap, in memory and on disk', async () => {
    const first = await start(3);
    const mail = transport(first.smtpPort);
    for (const n of [1, 2, 3, 4, 5]) {
      await mail.sendMail({ from: 'a@ampwright.test', to: 'b@c.test', subject: `m${n}`, text: String(n) });
    }
    const kept = await api<StoredMessage[]>(first.httpPort, '/messages');
    expect(kept.body.map((m) => m.subject)).toEqual(['m5', 'm4', 'm3']);
    await first.close();

    const second = await start(3);
    const reloaded = await api<StoredMessage[]>(second.httpPort, '/messages');
    expect(reloaded.body.map((m) => m.subject)).toEqual(['m5', 'm4', 'm3']);
    const lines = fs.readFileSync(path.join(stateDir, 'messages.jsonl'), 'utf8').trim().split('\n');
    expect(lines).toHaveLength(3);
  });

  it('answers health, unknown ids and unknown routes clearly', async () => {
    const { httpPort } = await start();
    expect((await api<{ ok: boolean }>(httpPort, '/health')).body.ok).toBe(true);
    const missing = await api<{ error: string }>(httpPort, '/messages/msg_nope');
    expect(missing.status).toBe(404);
    expect(missing.body.error).toContain('msg_nope');
    expect((await api(httpPort, '/nowhere')).status).toBe(404);
    expect((await api(httpPort, '/messages', 'PUT')).status).toBe(405);
  });

  it('skips unreadable lines in the state file instead of failing to start', async () => {
    const good = { id: 'msg_ok', subject: 'ok', to: [], cc: [], envelope: { from: null, to: [] } };
    fs.writeFileSync(path.join(stateDir, 'messages.jsonl'), `${JSON.stringify(good)}\n{not json\n`);
    const { httpPort } = await start();
    const body = (await api<StoredMessage[]>(httpPort, '/messages')).body;
    expect(body.map((m) => m.id)).toEqual(['msg_ok']);
  });

  describe('holds', () => {
    it('keeps the reply to a held recipient back until released, then accepts the message', async () => {
      const { smtpPort, httpPort } = await start();
      const created = await api<{ to: string; ms: number; outcome: string }>(httpPort, '/holds', 'POST', { to: 'Slow@Customer.test' });
      expect(created).toEqual({ status: 201, body: { to: 'slow@customer.test', ms: 60_000, outcome: 'accept' } });
      let replied = false;
      const sending = transport(smtpPort)
        .sendMail({ from: 'a@ampwright.test', to: 'slow@customer.test', subject: 'held', text: 'x' })
        .finally(() => (replied = true));
      await untilWaiting(httpPort, 'slow@customer.test');
      // Others pass while the hold lasts.
      await transport(smtpPort).sendMail({ from: 'a@ampwright.test', to: 'quick@customer.test', subject: 'free', text: 'y' });
      expect(replied).toBe(false);
      expect(await subjects(httpPort)).toEqual(['free']);
      expect((await api<{ released: number }>(httpPort, '/holds?to=slow@customer.test', 'DELETE')).body.released).toBe(1);
      await sending;
      expect(await subjects(httpPort)).toEqual(['held', 'free']);
      expect((await api<HoldRow[]>(httpPort, '/holds')).body).toEqual([]);
    });

    it('ends by itself after ms; a reject hold answers 451 and keeps nothing', async () => {
      const { smtpPort, httpPort } = await start();
      await api(httpPort, '/holds', 'POST', { to: 'timed@customer.test', ms: 300 });
      const started = Date.now();
      await transport(smtpPort).sendMail({ from: 'a@ampwright.test', to: 'timed@customer.test', subject: 'late', text: 'x' });
      expect(Date.now() - started).toBeGreaterThanOrEqual(250);
      await api(httpPort, '/holds', 'POST', { to: 'refused@customer.test', outcome: 'reject' });
      const refused = transport(smtpPort).sendMail({ from: 'a@ampwright.test', to: 'refused@customer.test', subject: 'no', text: 'x' });
      const outcome = expect(refused).rejects.toMatchObject({ responseCode: 451 });
      await untilWaiting(httpPort, 'refused@customer.test');
      await api(httpPort, '/holds', 'DELETE');
      await outcome;
      expect(await subjects(httpPort)).toEqual(['late']);
    });

    it('does not keep a held message whose sender went away before the reply', async () => {
      const { smtpPort, httpPort } = await start();
      await api(httpPort, '/holds', 'POST', { to: 'gone@customer.test' });
      const abort = new AbortController();
      const sending = transport(smtpPort).sendMail({ from: 'a@ampwright.test', to: 'gone@customer.test', subject: 'lost', text: 'x', signal: abort.signal });
      const failed = expect(sending).rejects.toThrow();
      await untilWaiting(httpPort, 'gone@customer.test');
      abort.abort();
      await failed;
      const end = Date.now() + 2000;
      while ((await api<HoldRow[]>(httpPort, '/holds')).body[0]?.waiting && Date.now() < end) await new Promise((r) => setTimeout(r, 20));
      await api(httpPort, '/holds', 'DELETE');
      expect(await subjects(httpPort)).toEqual([]);
    });

    it('refuses a hold without a valid address or with a bad time', async () => {
      const { httpPort } = await start();
      const noAddress = await api<{ error: string }>(httpPort, '/holds', 'POST', { ms: 100 });
      expect(noAddress.status).toBe(400);
      expect(noAddress.body.error).toMatch(/^to:/);
      expect((await api(httpPort, '/holds', 'POST', { to: 'x@y.test', ms: 0 })).status).toBe(400);
      expect((await api(httpPort, '/holds', 'POST', { to: 'x@y.test', outcome: 'maybe' })).status).toBe(400);
      expect((await api(httpPort, '/holds', 'PUT')).status).toBe(405);
      expect((await api<HoldRow[]>(httpPort, '/holds')).body).toEqual([]);
    });
  });
});
