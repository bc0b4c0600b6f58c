import { Craft } from '@/server/models';
import type { Revision, RevisionDetail } from '@/shared/schemas/revisions';
import type { Session } from '../helpers/sheet';
import { signIn } from '../helpers/sign-in';
import { createTestApp, type TestApp } from '../helpers/test-app';

/** The demo people by first name (their subjects at the sign-in fake are `demo-<name>`). */
type Person = 'tomas' | 'amara' | 'kenji' | 'lucia' | 'oren' | 'ines' | 'priya';

/** A test file's own database with Tern and the demo people it signs in, filled in before its tests run. */
export interface Tern<P extends Person> {
  testApp: TestApp;
  craftId: string;
  people: Record<P, Session>;
}

/** Registers the file's beforeAll (a fresh database, the people signed in) and afterAll (drops it). */
export function setUpTern<P extends Person>(names: readonly P[]): Tern<P> {
  const tern = { people: {} } as Tern<P>;
  beforeAll(async () => {
    tern.testApp = await createTestApp();
    tern.craftId = (await Craft.findOne({ where: { name: 'Tern' }, rejectOnEmpty: true })).id;
    for (const name of names) tern.people[name] = await signIn(tern.testApp.app, `demo-${name}`, 'sso');
  });
  afterAll(async () => {
    await tern.testApp.close();
  });
  return tern;
}

/** The craft's revisions as the person lists them (fails the test on any other status). */
export async function listRevisions(session: Session, craftId: string): Promise<Revision[]> {
  const response = await session.agent.get(`/api/crafts/${craftId}/revisions`).expect(200);
  return response.body.revisions as Revision[];
}

/** The revision with this label (a baseline's label, a study's name); fails the test when there is none. */
export async function revisionLabelled(session: Session, craftId: string, label: string): Promise<Revision> {
  const found = (await listRevisions(session, craftId)).find((revision) => revision.label === label);
  if (!found) throw new Error(`the craft has no revision "${label}"`);
  return found;
}

/** A revision's detail as the person reads it, with its path for row writes. */
export async function readRevision(session: Session, craftId: string, revisionId: string): Promise<RevisionDetail & { path: string }> {
  const path = `/api/crafts/${craftId}/revisions/${revisionId}`;
  const detail = await session.agent.get(path).expect(200);
  return { ...(detail.body as RevisionDetail), path };
}

/** POST with the person's CSRF token. */
export function post(session: Session, path: string, body: object) {
  return session.agent.post(path).set('x-csrf-token', session.csrfToken).send(body);
}
