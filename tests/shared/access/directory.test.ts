import { directoryReach, mayOnCraft } from '@/shared/access/permissions';

describe('directoryReach', () => {
  it('shows admins and people holding an engineering or viewing role the whole organisation', () => {
    expect(directoryReach({ isOrgAdmin: true, roles: [] })).toBe('organisation');
    expect(directoryReach({ isOrgAdmin: false, roles: ['viewer'] })).toBe('organisation');
    expect(directoryReach({ isOrgAdmin: false, roles: ['partner', 'subsystem_owner'] })).toBe('organisation');
  });

  it('shows partners, and people without a role yet, only the members of their crafts', () => {
    expect(directoryReach({ isOrgAdmin: false, roles: ['partner'] })).toBe('craft_members');
    expect(directoryReach({ isOrgAdmin: false, roles: ['partner', 'partner'] })).toBe('craft_members');
    expect(directoryReach({ isOrgAdmin: false, roles: [] })).toBe('craft_members');
  });

  it("hides members' e-mail addresses from a partner on their craft", () => {
    expect(mayOnCraft('viewContacts', { role: 'partner', isOrgAdmin: false })).toBe(false);
    expect(mayOnCraft('viewContacts', { role: 'viewer', isOrgAdmin: false })).toBe(true);
    expect(mayOnCraft('viewContacts', { role: null, isOrgAdmin: true })).toBe(true);
  });
});
