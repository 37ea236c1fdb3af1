/**
 * The notice pipeline end to end against the SMTP stand-in the test frame
 * starts: events emitted inside a Sequelize transaction (as the operations
 * services do) reach the right subscribers once; a rolled-back change sends
 * nothing; SMTP down then up delivers once; unsubscribe links work without
 * signing in. Also the subscription and contact routes.
 */
import jwt from 'jsonwebtoken';
import request from 'supertest';
import { beforeEach, describe, expect, it } from 'vitest';
import type { OperationsEvent, OperationsEventKind } from '@/server/operations/events';
import { Contact, Notice, Subscription } from '@/server/db/models/notices';
import { unsubscribeToken } from '@/server/notices/unsubscribe';
import { smallNetwork } from '../fixtures/small-network';
import { emailFor, useTestApp, type TestApp } from '../helpers/testApp';

const app = useTestApp({ network: smallNetwork });
let t: TestApp;
beforeEach(async () => {
  t = app();
});

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function waitFor<T>(what: string, probe: () => Promise<T | undefined> | T | undefined, ms = 20_000): Promise<T> {
  const until = Date.now() + ms;
  for (;;) {
    const v = await probe();
    if (v !== undefined) return v;
    if (Date.now() > until) throw new Error(`timed out waiting for ${what}`);
    await sleep(100);
  }
}

const mails = () => t.standins.mailbox!.list();
/** Waits for n mails, then a little longer to see that no more come. */
async function expectMails(n: number) {
  await waitFor(`${n} mails`, () => (mails().length >= n ? true : undefined));
  await sleep(1500);
  expect(mails().length).toBe(n);
  return mails();
}

function event(kind: OperationsEventKind, lost: string[], fallback: string[] = [], key = `${kind}-1`): OperationsEvent {
  const isWork = kind.startsWith('work-');
  return {
    kind,
    code: isWork ? 'W-7' : 'INC-3',
    title: isWork ? 'Feeder swap on the hill' : 'Line fault north',
    key,
    start: '2026-12-04T09:30:00.000Z',
    end: isWork ? '2026-12-04T13:00:00.000Z' : null,
    networkVersion: 2,
    reach: { lost, fallback, households: { lost: 2500 * lost.length, fallback: 1800 * fallback.length } },
    other: kind === 'work-clash' ? 'W-8' : undefined,
    summary: 'a change the operations desk made',
  };
}

const emit = (e: OperationsEvent) => t.db.sequelize.transaction(async (tr) => t.ctx.events!.emit(tr, e));

async function subscribe(role: 'admin' | 'engineer' | 'operator' | 'viewer', body: object) {
  const r = await request(t.app).post('/api/subscriptions').set(t.auth(role)).send(body);
  expect(r.status).toBe(200);
}
async function contact(body: object) {
  const r = await request(t.app).post('/api/contacts').set(t.auth('admin')).send(body);
  expect(r.status).toBe(201);
  return r.body as { id: number };
}

describe('subscriptions and contacts', () => {
  it('keeps each person their own choice; checks codes; admins keep contacts', async () => {
    await subscribe('operator', { services: ['TV1', 'TV1'], sites: ['R1'] });
    const mine = await request(t.app).get('/api/subscriptions').set(t.auth('operator'));
    expect(mine.body).toMatchObject({ everything: false, services: ['TV1'], sites: ['R1'], email: emailFor('operator') });
    expect((await request(t.app).get('/api/subscriptions').set(t.auth('viewer'))).body).toMatchObject({ everything: false, services: [], sites: [] });

    const bad = await request(t.app).post('/api/subscriptions').set(t.auth('viewer')).send({ services: ['NOPE'] });
    expect(bad.status).toBe(422);
    expect(bad.body.error.message).toMatch(/not in the network: service NOPE/);
    const empty = await request(t.app).post('/api/subscriptions').set(t.auth('viewer')).send({});
    expect(empty.status).toBe(400);
    expect(empty.body.error.message).toMatch(/choose everything/);

    expect((await request(t.app).delete('/api/subscriptions').set(t.auth('operator'))).status).toBe(204);
    expect(await Subscription.count()).toBe(0);

    const c = await contact({ name: 'Desk of a broadcaster', email: 'desk@broadcaster.example', organisation: 'A broadcaster', services: ['FM1'] });
    const dup = await request(t.app).post('/api/contacts').set(t.auth('admin')).send({ name: 'Again', email: 'DESK@broadcaster.example', everything: true });
    expect(dup.status).toBe(409);
    const upd = await request(t.app).put(`/api/contacts/${c.id}`).set(t.auth('admin')).send({ name: 'Desk', email: 'desk@broadcaster.example', everything: true });
    expect(upd.body).toMatchObject({ everything: true, services: [] });
    expect((await request(t.app).get('/api/contacts').set(t.auth('engineer'))).status).toBe(403);
    expect((await Contact.findAll()).map((x) => [x.name, x.everything])).toEqual([['Desk', true]]);
  });
});

describe('notices', () => {
  beforeEach(async () => {
    await subscribe('engineer', { services: ['FM1'] });
    await subscribe('operator', { sites: ['R1'] });
    await subscribe('viewer', { everything: true });
    await contact({ name: 'Programme desk', email: 'tv@broadcaster.example', services: ['TV1'] });
    await contact({ name: 'Site owner', email: 'owner@masts.example', sites: ['M1'] });
  });

  // Reach and who must be told: FM1 -> engineer; site R1 -> operator; everything -> viewer; TV1 -> tv desk; site M1 -> owner.
  const cases: Array<[OperationsEventKind, string[], string[], string[]]> = [
    ['incident-opened', ['R1.TV1'], [], ['operator', 'viewer', 'tv@broadcaster.example']],
    ['incident-updated', ['M1.FM1'], [], ['engineer', 'viewer', 'owner@masts.example']],
    ['incident-closed', [], ['R2.TV1'], ['viewer', 'tv@broadcaster.example']],
    ['work-approved', ['M1.TV1', 'M1.FM1'], [], ['engineer', 'viewer', 'tv@broadcaster.example', 'owner@masts.example']],
    ['work-started', [], ['R1.TV1'], ['operator', 'viewer', 'tv@broadcaster.example']],
    ['work-cancelled', ['O1.FM1'], [], ['engineer', 'viewer']],
    ['work-clash', [], [], ['viewer']],
  ];
  const address = (who: string) => (who.includes('@') ? who : emailFor(who as 'viewer'));

  it.each(cases)('%s reaches exactly the subscribers of its services and sites', async (kind, lost, fallback, who) => {
    await emit(event(kind, lost, fallback));
    const got = await expectMails(who.length);
    expect(got.flatMap((m) => m.to).sort()).toEqual(who.map(address).sort());
    const rows = await Notice.findAll();
    expect(rows.map((r) => [r.eventKind, r.status]).sort()).toEqual(who.map(() => [kind, 'sent']));
    const mail = got[0];
    expect(mail.subject.length).toBeLessThan(120);
    expect(mail.text).toMatch(/2026-12-04 09:30 UTC/);
    // the link opens the work's or the incident's own screen
    expect(mail.text).toContain(`Open in Headwater: http://headwater.test/${kind.startsWith('work-') ? 'works' : 'incidents'}/`);
    expect(mail.html).not.toMatch(/<img/i);
    expect(mail.headers['list-unsubscribe']).toMatch(/\/api\/unsubscribe\?token=/);
  });

  it('names what is off air and on reserve by service, with households', async () => {
    await emit(event('incident-opened', ['M1.TV1', 'R1.TV1'], ['M1.FM1']));
    const got = await expectMails(5);
    const m = got.find((x) => x.to[0] === emailFor('viewer'))!;
    expect(m.subject).toBe('Fault opened: INC-3 Line fault north, 2 carriages off air');
    expect(m.text).toContain('Off air: 2 carriages, 5,000 households');
    expect(m.text).toContain('On reserve: 1 carriage, 1,800 households');
    expect(m.text).toContain('- Multiplex One (TV1)\n    off air: M1.TV1 at Main One, R1.TV1 at Relay One');
    expect(m.text).toContain('- Corran Air (FM1)\n    on reserve: M1.FM1 at Main One');
    expect(m.html).toContain('<strong>Multiplex One (TV1)</strong>');
  });

  it('sends one mail per address for a repeated event', async () => {
    await emit(event('work-clash', [], [], 'clash-W-7-W-8'));
    await emit(event('work-clash', [], [], 'clash-W-7-W-8'));
    await expectMails(1);
    expect(await Notice.count()).toBe(1);
  });

  it('sends nothing for a change that is rolled back', async () => {
    await expect(
      t.db.sequelize.transaction(async (tr) => {
        await t.ctx.events!.emit(tr, event('incident-opened', ['R1.TV1']));
        throw new Error('the change failed');
      }),
    ).rejects.toThrow('the change failed');
    const [jobs] = await t.db.sequelize.query(`SELECT count(*)::int AS n FROM pgboss.job WHERE name = 'notice-send'`);
    expect((jobs as { n: number }[])[0].n).toBe(0);
    expect(await Notice.count()).toBe(0);
    await sleep(2000);
    expect(mails()).toEqual([]);
  });

  it('keeps a notice waiting while SMTP is down and sends it once when SMTP returns', async () => {
    const box = t.standins.mailbox!;
    await box.stop();
    await emit(event('work-clash', [], []));
    const failed = await waitFor('a failed attempt', async () => {
      const n = await Notice.findOne();
      return n && n.attempts >= 1 ? n : undefined;
    });
    expect(failed.status).toBe('waiting');
    expect(failed.lastError).toMatch(/ECONNREFUSED|connect/i);
    const admin = await request(t.app).get('/api/notices?status=waiting').set(t.auth('admin'));
    expect(admin.body.counts).toEqual({ waiting: 1, sent: 0, failed: 0 });
    expect(admin.body.items[0]).toMatchObject({ address: emailFor('viewer'), status: 'waiting' });
    expect(admin.body.items[0].lastError).toBeTruthy();

    await box.start();
    const got = await expectMails(1);
    expect(got[0].to).toEqual([emailFor('viewer')]);
    const sent = await Notice.findOne();
    expect(sent).toMatchObject({ status: 'sent', lastError: null });
    expect(sent!.attempts).toBeGreaterThanOrEqual(2);
  });

  it('stops the mail from the link without signing in; idempotent; a forged token is refused', async () => {
    await emit(event('work-clash', [], []));
    const [mail] = await expectMails(1);
    const link = new URL(/Stop these mails: (\S+)/.exec(mail.text)![1]);
    const path = `${link.pathname}${link.search}`;
    const page = await request(t.app).get(path);
    expect(page.status).toBe(200);
    expect(page.text).toContain('<form method="post"');
    expect(await Subscription.count({ where: { everything: true } })).toBe(1);
    for (let i = 0; i < 2; i++) {
      const r = await request(t.app).post(path).set('Accept', 'application/json');
      expect(r.status).toBe(200);
      expect(r.body).toEqual({ unsubscribed: true, email: emailFor('viewer') });
    }
    expect(await Subscription.count({ where: { everything: true } })).toBe(0);
    const forged = await request(t.app).post(`/api/unsubscribe?token=${t.tokenFor('viewer')}`);
    expect(forged.status).toBe(400);
    expect(forged.body.error.message).toMatch(/not valid/);
  });
});

describe('unsubscribe links that were tampered with', () => {
  const b64 = (o: object) => Buffer.from(JSON.stringify(o)).toString('base64url');

  it('refuses forged, truncated, re-signed and malformed tokens with 400, GET and POST alike, and changes nothing', async () => {
    await subscribe('viewer', { everything: true });
    const { id: contactId } = await contact({ name: 'Programme desk', email: 'tv@broadcaster.example', services: ['TV1'] });
    const viewerId = (await Subscription.findOne())!.userId;
    const secret = t.ctx.config.JWT_SECRET;
    const good = unsubscribeToken({ kind: 'user', id: viewerId, email: emailFor('viewer') }, secret);
    const [header, payload, signature] = good.split('.');
    const flipped = signature.slice(0, 5) + (signature[5] === 'A' ? 'B' : 'A') + signature.slice(6);
    const forContact = b64({ ...JSON.parse(Buffer.from(payload, 'base64url').toString()), sub: `contact:${contactId}`, email: 'tv@broadcaster.example' });
    const tokens: Record<string, string | string[]> = {
      truncated: good.slice(0, -12),
      'signature cut off': `${header}.${payload}.`,
      'one signature character changed': `${header}.${payload}.${flipped}`,
      "another subscriber's payload under this signature": `${header}.${forContact}.${signature}`,
      'alg none': `${b64({ alg: 'none', typ: 'JWT' })}.${payload}.`,
      'signed with the session key': jwt.sign({ email: emailFor('viewer') }, secret, { subject: `user:${viewerId}`, audience: 'headwater-unsubscribe' }),
      'a session token': t.tokenFor('viewer'),
      'not a token at all': 'hello',
      'ten thousand characters': 'a'.repeat(10_000),
      'given twice': [good, good],
    };
    const before = async () => ({
      subscriptions: (await Subscription.findAll()).map((s) => [s.userId, s.everything]),
      contacts: (await Contact.findAll()).map((c) => [c.id, c.services]),
    });
    const was = await before();
    for (const [what, token] of Object.entries(tokens)) {
      const query = (Array.isArray(token) ? token : [token]).map((v) => `token=${encodeURIComponent(v)}`).join('&');
      for (const method of ['get', 'post'] as const) {
        const r = await request(t.app)[method](`/api/unsubscribe?${query}`).set('Accept', 'application/json');
        expect([r.status, r.body.error?.code], `${method} ${what}`).toEqual([400, 'bad-token']);
      }
    }
    const none = await request(t.app).post('/api/unsubscribe');
    expect(none.status).toBe(400);
    expect(await before()).toEqual(was);
    // the untouched token still works, so the refusals above were about the tampering
    const ok = await request(t.app).post(`/api/unsubscribe?token=${good}`).set('Accept', 'application/json');
    expect(ok.status).toBe(200);
    expect(await Subscription.count()).toBe(0);
    expect((await Contact.findByPk(contactId))!.services).toEqual(['TV1']);
  });
});
