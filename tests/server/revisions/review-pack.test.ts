import { patchRow, readDraft, rowOf } from '../helpers/sheet';
import { pdfPages } from '../helpers/pdf-text';
import { revisionLabelled, setUpTern } from './tern';

jest.setTimeout(30_000);

const tern = setUpTern(['tomas', 'lucia']);

/** The review pack of a revision as its text, asserting it is a PDF download. */
async function packText(revisionId: string): Promise<string> {
  const { tomas } = tern.people;
  const response = await tomas.agent
    .get(`/api/crafts/${tern.craftId}/revisions/${revisionId}/review.pdf`)
    .buffer(true)
    .parse((res, done) => {
      const chunks: Buffer[] = [];
      res.on('data', (chunk: Buffer) => chunks.push(chunk));
      res.on('end', () => done(null, Buffer.concat(chunks)));
    })
    .expect(200);
  expect(response.headers['content-type']).toBe('application/pdf');
  expect(response.headers['content-disposition']).toMatch(/^attachment; filename="Tern-.*-review\.pdf"$/);
  expect(response.headers['x-content-type-options']).toBe('nosniff');
  return pdfPages(response.body as Buffer).join('\n');
}

describe('GET .../revisions/:revisionId/review.pdf', () => {
  it('packs the first baseline with who locked it, its headline figures and budget, and says it has no earlier one', async () => {
    const pdr = await revisionLabelled(tern.people.tomas, tern.craftId, 'PDR');
    const text = await packText(pdr.id);
    expect(text).toContain('Tern');
    expect(text).toContain('PDR');
    expect(text).toContain(`Locked by ${pdr.lockedBy?.name ?? ''}`);
    expect(text).toContain('Characteristic acceleration');
    expect(text).toContain('Mass budget');
    expect(text).toContain('first baseline of the craft');
    expect(text).toContain('Preliminary sizing estimates');
  });

  it('lists the changes since the previous baseline in a later one', async () => {
    const { tomas } = tern.people;
    const draft = await readDraft(tomas, tern.craftId);
    const side = rowOf(draft, 'sail_side');
    await patchRow(tomas, draft.path, 'sail_side', { version: side.version, value: (side.value ?? 0) + 5 }).expect(200);
    const cdr = await tomas.agent.post(`${draft.path}/lock`).set('x-csrf-token', tomas.csrfToken).send({ label: 'CDR' }).expect(201);
    const text = await packText(cdr.body.id);
    expect(text).toContain('Changes since baseline "PDR"');
    expect(text).toContain('Sail side length (sail_side)');
    expect(text).toContain('Outputs that moved');
    expect(text).toContain('Sail area (sail_area)');
  });

  it('is refused to a partner, who does not read the whole sheet', async () => {
    const { lucia, tomas } = tern.people;
    const pdr = await revisionLabelled(tomas, tern.craftId, 'PDR');
    const refused = await lucia.agent.get(`/api/crafts/${tern.craftId}/revisions/${pdr.id}/review.pdf`).expect(403);
    expect(refused.body.error.message).toMatch(/whole sheet/);
  });
});
