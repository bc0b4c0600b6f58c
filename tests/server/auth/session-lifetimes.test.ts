import request from 'supertest';
import { QueryTypes } from 'sequelize';
import { sweepSessions } from '@/server/auth/session';
import { User } from '@/server/models';
import { cookieHeaderOf, signIn } from '../helpers/sign-in';
import { createTestApp, type TestApp } from '../helpers/test-app';

let testApp: TestApp;

beforeAll(async () => {
  testApp = await createTestApp();
});

afterAll(async () => {
  await testApp.close();
});

interface SessionRow {
  sid: string;
  userId: string | null;
  /** Seconds from now to the idle expiry and to the absolute end. */
  expiresIn: number;
  endsIn: number;
  version: string;
}

async function sessionRows(): Promise<SessionRow[]> {
  return testApp.sequelize.query<SessionRow>(
    `SELECT sid, sess -> 'passport' ->> 'user' AS "userId", extract(epoch FROM expire - now())::float AS "expiresIn",
            extract(epoch FROM ends_at - now())::float AS "endsIn", xmin::text AS version
     FROM sessions ORDER BY expire`,
    { type: QueryTypes.SELECT },
  );
}

/** The one session row of a signed-in agent (its cookie's). */
async function rowOf(agent: request.Agent): Promise<SessionRow> {
  const { user } = (await agent.get('/api/auth/session').expect(200)).body as { user: { id: string } };
  const rows = (await sessionRows()).filter((row) => row.userId === user.id);
  const [row] = rows;
  if (!row || rows.length !== 1) throw new Error(`expected one session of ${user.id}, found ${rows.length}`);
  return row;
}

beforeEach(async () => {
  await testApp.sequelize.query('DELETE FROM sessions');
});

describe('an anonymous visitor', () => {
  it('costs no session row, however often they ask who is signed in', async () => {
    for (let visit = 0; visit < 20; visit += 1) await request(testApp.app).get('/api/auth/session').expect(200);
    await request(testApp.app).get('/api/crafts').expect(401);
    expect(await sessionRows()).toEqual([]);
  });

  it('gets a row for ten minutes when a sign-in starts, and the sweep deletes it once it has ended', async () => {
    const agent = request.agent(testApp.app);
    await agent.get('/api/auth/sso').expect(302);
    const [started, ...others] = await sessionRows();
    expect(others).toEqual([]);
    expect(started).toEqual(expect.objectContaining({ userId: null }));
    expect(started?.expiresIn).toBeGreaterThan(9 * 60);
    expect(started?.expiresIn).toBeLessThanOrEqual(10 * 60);
    expect(started?.endsIn).toBeLessThanOrEqual(10 * 60);

    // Asking again within the ten minutes does not extend it.
    await agent.get('/api/auth/sso').expect(302);
    const [again] = await sessionRows();
    expect(again?.endsIn).toBeLessThanOrEqual(started?.endsIn ?? 0);

    await testApp.sequelize.query(`UPDATE sessions SET expire = now() - interval '1 second'`);
    expect(await sweepSessions(testApp.sequelize)).toBe(1);
    expect(await sessionRows()).toEqual([]);
  });
});

/**
 * Another API process on the same database: it has read no session yet, so it sees the rows as the test leaves
 * them (each process reuses a session it read for a few seconds).
 */
const otherProcess = (agent: request.Agent, cookie = cookieHeaderOf(agent)) => {
  const app = testApp.appWith((config) => config);
  return {
    user: async () => (await request(app).get('/api/auth/session').set('cookie', cookie).expect(200)).body.user as unknown,
    crafts: () => request(app).get('/api/crafts').set('cookie', cookie),
  };
};

describe('a signed-in session', () => {
  it('ends after the idle time unused and, however much it is used, at the absolute lifetime', async () => {
    const { agent } = await signIn(testApp.app, 'demo-amara', 'sso');
    const row = await rowOf(agent);
    expect(row.expiresIn).toBeCloseTo(testApp.config.session.idleMs / 1000, -1);
    expect(row.endsIn).toBeCloseTo(testApp.config.session.absoluteMs / 1000, -1);
    // Only the signed-in session is left: the one of the sign-in in progress was replaced at sign-in.
    expect(await sessionRows()).toHaveLength(1);

    // Near its end, a touch moves the idle expiry up to the absolute end and no further.
    await testApp.sequelize.query(`UPDATE sessions SET ends_at = now() + interval '2 minutes', expire = now() + interval '30 seconds'`);
    expect(await otherProcess(agent).user()).not.toBeNull();
    const capped = await rowOf(agent);
    expect(capped.expiresIn).toBeCloseTo(capped.endsIn, 3);
    expect(capped.endsIn).toBeLessThanOrEqual(120);

    await testApp.sequelize.query(`UPDATE sessions SET ends_at = now() - interval '1 second'`);
    const later = otherProcess(agent);
    expect(await later.user()).toBeNull();
    await later.crafts().expect(401);
  });

  it('is touched at most once a minute, not on every request', async () => {
    const { agent } = await signIn(testApp.app, 'demo-tomas', 'google');
    const before = await rowOf(agent);
    for (let use = 0; use < 5; use += 1) await agent.get('/api/crafts').expect(200);
    for (let use = 0; use < 5; use += 1) await otherProcess(agent).crafts().expect(200);
    const after = await rowOf(agent);
    expect(after.version).toBe(before.version);

    // Last moved more than a minute ago: the next request moves the idle expiry forward again.
    await testApp.sequelize.query(`UPDATE sessions SET expire = expire - interval '2 minutes'`);
    await otherProcess(agent).crafts().expect(200);
    const touched = await rowOf(agent);
    expect(touched.expiresIn).toBeCloseTo(testApp.config.session.idleMs / 1000, -1);
  });

  it('ended in one process is ended there at once, cookie or not, and in another once it reads the session again', async () => {
    const { agent, csrfToken } = await signIn(testApp.app, 'demo-kenji', 'sso');
    const cookie = cookieHeaderOf(agent);
    await agent.get('/api/crafts').expect(200);
    await agent.post('/api/auth/sign-out').set('x-csrf-token', csrfToken).expect(204);
    // The old cookie, kept by someone who copied it, opens nothing here at once…
    await request(testApp.app).get('/api/crafts').set('cookie', cookie).expect(401);
    // …nor in another process that reads the session afresh.
    await otherProcess(agent, cookie).crafts().expect(401);
  });

  it('is read with its person in one statement: no second look-up of the person', async () => {
    const { agent } = await signIn(testApp.app, 'demo-oren', 'sso');
    const lookUps = jest.spyOn(User, 'findByPk');
    try {
      const { user } = (await agent.get('/api/auth/session').expect(200)).body as { user: { name: string } };
      expect(user.name).toBe('Oren Vasquez');
      await agent.get('/api/crafts').expect(200);
      expect(lookUps).not.toHaveBeenCalled();
    } finally {
      lookUps.mockRestore();
    }
  });

  it('lasts as long as the configuration says', async () => {
    const app = testApp.appWith((config) => ({ ...config, session: { ...config.session, absoluteMs: 3_600_000, idleMs: 600_000 } }));
    const { agent } = await signIn(app, 'demo-lucia', 'sso');
    const row = await rowOf(agent);
    expect(row.expiresIn).toBeCloseTo(600, -1);
    expect(row.endsIn).toBeCloseTo(3600, -1);
  });
});
