import { mayOnAnyRow, mayOnRow, whyNotOnRow, type RevisionStanding, type Who } from '@/shared/access/permissions';

const booms = { subsystemId: 'booms', subsystemName: 'Booms' };
const optics = { subsystemId: 'optics', subsystemName: 'Optics' };
const kenji: Who = { role: 'subsystem_owner', isOrgAdmin: false, subsystemIds: ['booms'], userId: 'kenji' };
const amara: Who = { role: 'systems_engineer', isOrgAdmin: false, userId: 'amara' };
const lucia: Who = { role: 'partner', isOrgAdmin: false, subsystemIds: ['optics'], userId: 'lucia' };
const oren: Who = { role: 'viewer', isOrgAdmin: false, userId: 'oren' };
const study = (owner: string, state: RevisionStanding['state'] = 'open'): RevisionStanding => ({
  kind: 'study',
  state,
  createdBy: { id: owner },
});
const draft: RevisionStanding = { kind: 'draft', state: 'open', createdBy: { id: 'tomas' } };

describe('rows of a study', () => {
  it("lets the study's owner edit and manage every row, whatever subsystems they own", () => {
    for (const action of ['editRow', 'manageRow'] as const) {
      expect(mayOnRow(action, kenji, optics, study('kenji'))).toBe(true);
      expect(mayOnAnyRow(action, kenji, study('kenji'))).toBe(true);
    }
    // In the draft, ownership still limits him to his subsystems and to content.
    expect(mayOnRow('editRow', kenji, optics, draft)).toBe(false);
    expect(mayOnRow('manageRow', kenji, booms, draft)).toBe(false);
  });

  it("lets a subsystem owner only read someone else's study, even their own subsystem's rows, and says why", () => {
    expect(mayOnRow('viewRow', kenji, booms, study('amara'))).toBe(true);
    expect(mayOnRow('editRow', kenji, booms, study('amara'))).toBe(false);
    expect(mayOnAnyRow('editRow', kenji, study('amara'))).toBe(false);
    expect(whyNotOnRow('editRow', kenji, booms, study('amara'))).toMatch(/its owner and by systems and chief engineers/);
  });

  it("lets systems and chief engineers edit anyone's study", () => {
    expect(mayOnRow('manageRow', amara, booms, study('kenji'))).toBe(true);
    expect(mayOnRow('editRow', { role: 'chief_engineer', isOrgAdmin: false, userId: 'tomas' }, optics, study('kenji'))).toBe(true);
  });

  it('keeps partners, viewers and admins without a role to reading, even in a study they somehow created', () => {
    expect(mayOnRow('editRow', lucia, optics, study('lucia'))).toBe(false);
    expect(mayOnRow('viewRow', lucia, booms, study('lucia'))).toBe(false);
    expect(mayOnRow('editRow', oren, optics, study('oren'))).toBe(false);
    expect(whyNotOnRow('editRow', oren, optics, study('kenji'))).toMatch(/Viewers read/);
    expect(mayOnRow('editRow', { role: null, isOrgAdmin: true, userId: 'ines' }, optics, study('ines'))).toBe(false);
  });

  it('lets nobody change a promoted (locked) study, its owner included', () => {
    expect(mayOnRow('editRow', kenji, booms, study('kenji', 'locked'))).toBe(false);
    expect(mayOnRow('editRow', amara, booms, study('kenji', 'locked'))).toBe(false);
    expect(whyNotOnRow('editRow', amara, booms, study('kenji', 'locked'))).toMatch(/promoted and is locked/);
    expect(whyNotOnRow('editRow', amara, booms, { kind: 'baseline', state: 'locked' })).toBe(
      'This baseline is locked: its rows cannot change',
    );
  });

  it('knows no owner without the person id', () => {
    const { userId: _userId, ...anonymous } = kenji;
    expect(mayOnRow('editRow', anonymous, optics, study('kenji'))).toBe(false);
  });
});
