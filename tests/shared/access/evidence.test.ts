import { mayOnRow, mayRemoveEvidence, whyNotOnRow, type RevisionStanding, type Who } from '@/shared/access/permissions';

const draft: RevisionStanding = { kind: 'draft', state: 'open' };
const baseline: RevisionStanding = { kind: 'baseline', state: 'locked' };
const booms = { subsystemId: 'booms', subsystemName: 'Booms' };
const membrane = { subsystemId: 'membrane', subsystemName: 'Sail membrane' };
const owner: Who = { role: 'subsystem_owner', isOrgAdmin: false, subsystemIds: ['booms'], userId: 'kenji' };
const partner: Who = { role: 'partner', isOrgAdmin: false, subsystemIds: ['membrane'], userId: 'lucia' };
const viewer: Who = { role: 'viewer', isOrgAdmin: false, userId: 'oren' };
const systems: Who = { role: 'systems_engineer', isOrgAdmin: false, userId: 'amara' };

describe('attaching evidence', () => {
  it('is for who edits the row, and partners on the rows shared with them', () => {
    expect(mayOnRow('attachEvidence', owner, booms, draft)).toBe(true);
    expect(mayOnRow('attachEvidence', owner, membrane, draft)).toBe(false);
    expect(mayOnRow('attachEvidence', partner, membrane, draft)).toBe(true);
    expect(mayOnRow('attachEvidence', partner, booms, draft)).toBe(false);
    expect(mayOnRow('attachEvidence', viewer, booms, draft)).toBe(false);
    expect(mayOnRow('attachEvidence', systems, membrane, draft)).toBe(true);
  });

  it('never happens in a locked baseline', () => {
    expect(mayOnRow('attachEvidence', systems, booms, baseline)).toBe(false);
    expect(whyNotOnRow('attachEvidence', systems, booms, baseline)).toBe('This baseline is locked: its rows cannot change');
  });
});

describe('removing evidence', () => {
  it("is for the row's owner and the engineers, and for whoever attached the file while they may attach", () => {
    expect(mayRemoveEvidence(owner, booms, draft, { uploadedById: 'amara' })).toBe(true);
    expect(mayRemoveEvidence(systems, membrane, draft, { uploadedById: 'lucia' })).toBe(true);
    expect(mayRemoveEvidence(partner, membrane, draft, { uploadedById: 'lucia' })).toBe(true);
    expect(mayRemoveEvidence(partner, membrane, draft, { uploadedById: 'amara' })).toBe(false);
    expect(mayRemoveEvidence(partner, membrane, baseline, { uploadedById: 'lucia' })).toBe(false);
    expect(mayRemoveEvidence(viewer, booms, draft, { uploadedById: null })).toBe(false);
    expect(whyNotOnRow('removeEvidence', partner, membrane, draft)).toBe(
      'Evidence is removed by whoever attached it, the owner of its subsystem or an engineer',
    );
  });
});
