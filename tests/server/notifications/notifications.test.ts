import net from 'node:net';
import { QueryTypes } from 'sequelize';
import { startMailFake, type MailFake } from '@/server/dev/mail-fake';
import { Craft, User } from '@/server/models';
import { createMailer } from '@/server/services/mailer';
import { collectDigests, DIGEST_MINUTES, notify, sendDueMail } from '@/server/services/notifications';
import { patchRow, readDraft, rowOf, type Session } from '../helpers/sheet';
import { signIn } from '../helpers/sign-in';
import { createTestApp, type TestApp } from '../helpers/test-app';

jest.setTimeout(30_000);

let testApp: TestApp;
let ternId: string;
let amara: Session;
let kenji: Session;
let kenjiUser: User;
let fake: MailFake;
let smtpPort: number;

/** A port free on loopback now, so the test's own mail fake can be stopped and started again on it. */
async function freePort(): Promise<number> {
  const server = net.createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as net.AddressInfo;
  await new Promise<void>((resolve) => server.close(() => resolve()));
  return port;
}

function mailerTo(port: number) {
  return createMailer({ ...testApp.config.smtp, host: '127.0.0.1', port, ignoreTls: true, user: undefined, pass: undefined });
}

/** Time as the digest sees it: past the wait of every notification written so far. */
const afterTheWait = () => new Date(Date.now() + (DIGEST_MINUTES + 1) * 60_000);

beforeAll(async () => {
  testApp = await createTestApp();
  ternId = (await Craft.findOne({ where: { name: 'Tern' }, rejectOnEmpty: true })).id;
  amara = await signIn(testApp.app, 'demo-amara', 'sso');
  kenji = await signIn(testApp.app, 'demo-kenji', 'sso');
  kenjiUser = await User.findOne({ where: { name: 'Kenji Hollis' }, rejectOnEmpty: true });
  smtpPort = await freePort();
  fake = await startMailFake({ smtpPort, httpPort: 0 });
});

afterAll(async () => {
  await fake.close();
  await testApp.close();
});

async function notificationsOf(session: Session) {
  return (await session.agent.get('/api/notifications').expect(200)).body as {
    notifications: { id: string; kind: string; title: string; body: string; readAt: string | null }[];
    unread: number;
  };
}

async function outboxTo(email: string) {
  return testApp.sequelize.query<{ subject: string; text: string; sent_at: Date | null; attempts: number }>(
    'SELECT subject, text, sent_at, attempts FROM mail_outbox WHERE to_address = $1 ORDER BY created_at',
    { bind: [email], type: QueryTypes.SELECT },
  );
}

describe('notifications of row changes', () => {
  it("tells a row's owner when someone else changes it, and not the one who changed it", async () => {
    const draft = await readDraft(amara, ternId);
    const row = rowOf(draft, 'boom_linear_density');
    await patchRow(amara, draft.path, 'boom_linear_density', { version: row.version, value: 16 }).expect(200);
    const kenjis = await notificationsOf(kenji);
    expect(kenjis.notifications[0]).toEqual(
      expect.objectContaining({ kind: 'row_changed', title: 'Amara Osei changed boom_linear_density on Tern', readAt: null }),
    );
    expect(kenjis.notifications[0]?.body).toContain('→ 16 g/m');
    expect(kenjis.unread).toBeGreaterThan(0);
    expect((await notificationsOf(amara)).notifications.filter((entry) => entry.title.startsWith('Amara Osei'))).toEqual([]);

    // His own edit tells nobody: he owns the row and nobody else does.
    const now = await readDraft(kenji, ternId);
    await patchRow(kenji, now.path, 'boom_linear_density', { version: rowOf(now, 'boom_linear_density').version, value: 17 }).expect(200);
    expect((await notificationsOf(kenji)).notifications.filter((entry) => entry.title.startsWith('Kenji'))).toEqual([]);
  });

  it('gathers the changes waiting for a person into one mail after the wait, and sends it', async () => {
    const draft = await readDraft(amara, ternId);
    await patchRow(amara, draft.path, 'deployer_mass', { version: rowOf(draft, 'deployer_mass').version, value: 5.5 }).expect(200);
    await patchRow(amara, draft.path, 'boom_count', { version: rowOf(draft, 'boom_count').version, value: 4 }).expect(200);
    // Not yet: the first change has not waited long enough.
    expect(await collectDigests(testApp.sequelize, new Date())).toBe(0);
    expect(await collectDigests(testApp.sequelize, afterTheWait())).toBe(1);
    const digest = (await outboxTo(kenjiUser.email)).find((mail) => mail.subject.endsWith('changes to rows you own'));
    expect(digest?.subject).toMatch(/^\d+ changes to rows you own$/);
    expect(digest?.text).toContain('deployer_mass');
    expect(digest?.text).toContain('boom_linear_density');
    // Gathered once: nothing is left waiting for him.
    expect(await collectDigests(testApp.sequelize, afterTheWait())).toBe(0);

    const mailer = mailerTo(smtpPort);
    try {
      expect(await sendDueMail(testApp.sequelize, mailer)).toBeGreaterThanOrEqual(1);
    } finally {
      mailer.close();
    }
    expect(fake.messages.filter((message) => message.to.includes(kenjiUser.email)).map((message) => message.subject)).toContain(
      digest?.subject,
    );
  });

  it('mails nothing of a kind the person turned off, but keeps it in the list', async () => {
    await kenji.agent
      .put('/api/account/mail-preferences')
      .set('x-csrf-token', kenji.csrfToken)
      .send({ mail: { baseline_locked: true, study_promoted: true, row_changed: false } })
      .expect(200);
    expect((await kenji.agent.get('/api/account/mail-preferences').expect(200)).body.mail.row_changed).toBe(false);
    const draft = await readDraft(amara, ternId);
    const mailsBefore = (await outboxTo(kenjiUser.email)).length;
    await patchRow(amara, draft.path, 'deployer_mass', { version: rowOf(draft, 'deployer_mass').version, value: 6 }).expect(200);
    expect((await notificationsOf(kenji)).notifications[0]?.body).toContain('deployer_mass');
    await collectDigests(testApp.sequelize, afterTheWait());
    expect(await outboxTo(kenjiUser.email)).toHaveLength(mailsBefore);
    await kenji.agent
      .put('/api/account/mail-preferences')
      .set('x-csrf-token', kenji.csrfToken)
      .send({ mail: { baseline_locked: true, study_promoted: true } })
      .expect(400);
  });

  it('marks notifications read, only the person’s own', async () => {
    const before = await notificationsOf(kenji);
    const first = before.notifications[0];
    if (first === undefined) throw new Error('Kenji has notifications by now');
    await amara.agent
      .post('/api/notifications/read')
      .set('x-csrf-token', amara.csrfToken)
      .send({ ids: [first.id] })
      .expect(204);
    expect((await notificationsOf(kenji)).unread).toBe(before.unread);
    await kenji.agent
      .post('/api/notifications/read')
      .set('x-csrf-token', kenji.csrfToken)
      .send({ ids: [first.id] })
      .expect(204);
    expect((await notificationsOf(kenji)).unread).toBe(before.unread - 1);
    await kenji.agent.post('/api/notifications/read').set('x-csrf-token', kenji.csrfToken).send({}).expect(204);
    expect((await notificationsOf(kenji)).unread).toBe(0);
  });
});

describe('notifications of baselines and promotions', () => {
  it('tells the owners of rows in a new baseline at once, by mail too', async () => {
    const tomas = await signIn(testApp.app, 'demo-tomas', 'sso');
    const draft = await readDraft(tomas, ternId);
    await tomas.agent
      .post(`${draft.path}/lock`)
      .set('x-csrf-token', tomas.csrfToken)
      .send({ label: 'Notification review', note: '' })
      .expect(201);
    expect((await notificationsOf(kenji)).notifications[0]).toEqual(
      expect.objectContaining({ kind: 'baseline_locked', title: 'Baseline "Notification review" locked on Tern' }),
    );
    expect((await outboxTo(kenjiUser.email)).map((mail) => mail.subject)).toContain('Baseline "Notification review" locked on Tern');
    // Amara is a systems engineer, not an owner of rows: she is not told.
    expect((await notificationsOf(amara)).notifications.filter((entry) => entry.kind === 'baseline_locked')).toEqual([]);
  });
});

describe('the mail outbox', () => {
  it('loses nothing while the mail server is down, and sends it once it is back', async () => {
    const tomas = await User.findOne({ where: { name: 'Tomás Reyes' }, rejectOnEmpty: true });
    await testApp.sequelize.transaction((transaction) =>
      notify(testApp.sequelize, transaction, {
        craftId: ternId,
        kind: 'baseline_locked',
        title: 'Baseline "Outage test" locked on Tern',
        body: 'Locked while the mail server was down.',
        actorId: tomas.id,
        userIds: [kenjiUser.id],
      }),
    );
    await fake.close();
    const mailer = mailerTo(smtpPort);
    try {
      expect(await sendDueMail(testApp.sequelize, mailer)).toBe(0);
      const [waiting] = (await outboxTo(kenjiUser.email)).filter((mail) => mail.subject.includes('Outage test'));
      expect(waiting).toEqual(expect.objectContaining({ sent_at: null, attempts: 1 }));

      fake = await startMailFake({ smtpPort, httpPort: 0 });
      // The retry is due 30 s later: bring it forward rather than wait.
      await testApp.sequelize.query("UPDATE mail_outbox SET next_attempt_at = now() WHERE subject LIKE '%Outage test%'");
      expect(await sendDueMail(testApp.sequelize, mailer)).toBe(1);
    } finally {
      mailer.close();
    }
    expect(fake.messages.map((message) => message.subject)).toContain('Baseline "Outage test" locked on Tern');
  });
});
