import type { RevisionDetail, RevisionParameter } from '@/shared/schemas/revisions';
import type { Agent } from './sign-in';

/** A signed-in person's agent and CSRF token, as signIn returns them. */
export interface Session {
  agent: Agent;
  csrfToken: string;
}

/** The craft's working draft as the person reads it (fails the test on any other status). */
export async function readDraft(session: Session, craftId: string): Promise<RevisionDetail & { path: string }> {
  const craft = await session.agent.get(`/api/crafts/${craftId}`).expect(200);
  const path = `/api/crafts/${craftId}/revisions/${String(craft.body.draftRevisionId)}`;
  const detail = await session.agent.get(path).expect(200);
  return { ...(detail.body as RevisionDetail), path };
}

/** The row with this key in a revision's detail; fails the test when it is absent. */
export function rowOf(detail: RevisionDetail, key: string): RevisionParameter {
  const row = detail.sheet.parameters.find((parameter) => parameter.key === key);
  if (!row) throw new Error(`the revision has no row "${key}"`);
  return row;
}

/** PATCH of one row, with the person's CSRF token. */
export function patchRow(session: Session, revisionPath: string, key: string, body: object) {
  return session.agent.patch(`${revisionPath}/parameters/${key}`).set('x-csrf-token', session.csrfToken).send(body);
}
