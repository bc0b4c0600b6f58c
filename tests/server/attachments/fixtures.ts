import type { Session } from '../helpers/sheet';

/** Small files of each kind, by their real signatures. */
export const files = {
  pdf: Buffer.from('%PDF-1.4\n1 0 obj\n<< /Type /Catalog >>\nendobj\ntrailer\n<< /Root 1 0 R >>\n%%EOF\n'),
  png: Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==', 'base64'),
  csv: Buffer.from('item,mass_kg\nboom 1,0.412\nboom 2,0.409\n'),
  /** A Windows executable's first bytes ("MZ", then padding). */
  exe: Buffer.concat([Buffer.from('MZ'), Buffer.alloc(126, 0x90)]),
  html: Buffer.from('<!DOCTYPE html><html><body><script>fetch("/api/account")</script></body></html>'),
  svg: Buffer.from('<svg xmlns="http://www.w3.org/2000/svg" onload="alert(1)"><rect width="1" height="1"/></svg>'),
  /** An empty zip archive (end-of-central-directory record only). */
  zip: Buffer.from('504b0506000000000000000000000000000000000000', 'hex'),
};

/** POSTs a file to a row's attachments as multipart, with the person's CSRF token. */
export function attach(session: Session, revisionPath: string, key: string, file: Buffer, name: string, kind = 'datasheet') {
  return session.agent
    .post(`${revisionPath}/parameters/${key}/attachments`)
    .set('x-csrf-token', session.csrfToken)
    .field('kind', kind)
    .attach('file', file, name);
}

/** The row's attachments as the person lists them (fails the test on any other status than 200). */
export async function listed(session: Session, revisionPath: string, key: string) {
  const response = await session.agent.get(`${revisionPath}/parameters/${key}/attachments`).expect(200);
  return response.body as { attachments: { id: string; name: string; kind: string; removable: boolean }[]; attachRefusal?: string };
}

/** DELETE of one file from a row. */
export function detach(session: Session, revisionPath: string, key: string, attachmentId: string) {
  return session.agent.delete(`${revisionPath}/parameters/${key}/attachments/${attachmentId}`).set('x-csrf-token', session.csrfToken);
}
