import type { Sequelize } from 'sequelize';
import { Craft, Membership, Organisation, User } from '../models';
import { demoCrafts, demoOrganisations, demoPeople } from './demo-scenario';

/** Seeds the invented demo scenario. Idempotent: existing rows are found by their natural keys and kept. */
export async function seedDemo(sequelize: Sequelize): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    for (const key of ['corvid', 'pelagic'] as const) {
      const [organisation] = await Organisation.findOrCreate({ where: { slug: demoOrganisations[key].slug }, defaults: demoOrganisations[key], transaction });
      const [craft] = await Craft.findOrCreate({
        where: { organisationId: organisation.id, name: demoCrafts[key].name },
        defaults: { ...demoCrafts[key], organisationId: organisation.id, createdById: null },
        transaction,
      });
      for (const person of demoPeople.filter((p) => p.organisation === key)) {
        const [user] = await User.findOrCreate({
          where: { email: person.email },
          defaults: { email: person.email, name: person.name, isOrgAdmin: person.isOrgAdmin, organisationId: organisation.id },
          transaction,
        });
        if (person.craftRole) {
          await Membership.findOrCreate({
            where: { craftId: craft.id, userId: user.id },
            defaults: { craftId: craft.id, userId: user.id, role: person.craftRole, subsystems: person.subsystems ?? [] },
            transaction,
          });
        }
      }
    }
  });
}
