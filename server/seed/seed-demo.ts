import { QueryTypes, type Sequelize } from 'sequelize';
import { findTemplate, instantiateTemplate } from '@/shared/templates';
import { Craft, Identity, Membership, Organisation, User } from '../models';
import { lockBaseline } from '../services/baselines';
import { updateParameter } from '../services/parameters';
import { createDraft, draftIdOf, ensureSubsystems } from '../services/sheet-store';
import { openStudy } from '../services/studies';
import { selectRows } from '../models/sheet-rows';
import { demoCrafts, demoOrganisations, demoPeople, ternStory, type DemoChange } from './demo-scenario';

/**
 * Seeds the invented demo scenario. Idempotent: existing rows are found by their natural keys and kept; a
 * craft without a working draft gets one from the square-sail template, and Tern's history (edits, the
 * PDR baseline, a study) is replayed through the API's own services only while its draft has none.
 */
export async function seedDemo(sequelize: Sequelize): Promise<void> {
  const template = findTemplate('square-sail');
  if (!template) throw new Error('the square-sail template is missing');
  const craftIds = { corvid: '', pelagic: '' };
  await sequelize.transaction(async (transaction) => {
    for (const key of ['corvid', 'pelagic'] as const) {
      const [organisation] = await Organisation.findOrCreate({
        where: { slug: demoOrganisations[key].slug },
        defaults: demoOrganisations[key],
        transaction,
      });
      const [craft] = await Craft.findOrCreate({
        where: { organisationId: organisation.id, name: demoCrafts[key].name },
        defaults: { ...demoCrafts[key], organisationId: organisation.id, createdById: null, templateId: template.id },
        transaction,
      });
      craftIds[key] = craft.id;
      // People first, then the draft (its subsystems in the sheet's order), then memberships naming subsystems.
      const people = demoPeople.filter((p) => p.organisation === key);
      const users = new Map<string, User>();
      for (const person of people) {
        const [user] = await User.findOrCreate({
          where: { email: person.email },
          defaults: { email: person.email, name: person.name, isOrgAdmin: person.isOrgAdmin, organisationId: organisation.id },
          transaction,
        });
        users.set(person.subject, user);
        // The sign-in fake offers demo people under both providers with one subject; their sign-ins are linked
        // here, as a person's own link would, since an e-mail address alone never links one.
        for (const provider of ['google', 'sso'] as const) {
          await Identity.findOrCreate({
            where: { provider, subject: person.subject },
            defaults: { provider, subject: person.subject, userId: user.id },
            transaction,
          });
        }
      }
      if ((await draftIdOf(sequelize, craft.id, transaction)) === null) {
        const chief = people.find((person) => person.craftRole === 'chief_engineer');
        const chiefId = chief ? (users.get(chief.subject)?.id ?? null) : null;
        await createDraft(sequelize, craft.id, instantiateTemplate(template), chiefId, transaction);
      }
      for (const person of people) {
        const user = users.get(person.subject);
        if (!person.craftRole || !user) continue;
        const idByName = await ensureSubsystems(sequelize, craft.id, person.subsystems ?? [], transaction);
        const subsystemIds = (person.subsystems ?? []).flatMap((name) => idByName.get(name) ?? []);
        const [membership, created] = await Membership.findOrCreate({
          where: { craftId: craft.id, userId: user.id },
          defaults: { craftId: craft.id, userId: user.id, role: person.craftRole, subsystemIds },
          transaction,
        });
        // A database seeded before subsystems were shared with partners gets the demo's sharing once.
        if (!created && membership.subsystemIds.length === 0 && subsystemIds.length > 0) {
          await membership.update({ subsystemIds }, { transaction });
        }
      }
    }
  });
  await replayTernHistory(sequelize, craftIds.corvid);
}

/** Applies a demo change to a row of a revision as the person, through the API's own service. */
async function applyChange(sequelize: Sequelize, user: User, craftId: string, revisionId: string, { key, change }: DemoChange) {
  const row = (await selectRows(sequelize, revisionId)).find((candidate) => candidate.key === key);
  if (!row) throw new Error(`the demo change names no row "${key}"`);
  await updateParameter(sequelize, user, craftId, revisionId, key, { version: row.version, ...change });
}

/** Plays Tern's story as its people, through the API's own services, while the draft has no history. */
async function replayTernHistory(sequelize: Sequelize, craftId: string) {
  const draftId = await draftIdOf(sequelize, craftId);
  if (draftId === null) return;
  const [recorded] = await sequelize.query<{ count: string }>('SELECT count(*) AS count FROM parameter_changes WHERE revision_id = $1', {
    bind: [draftId],
    type: QueryTypes.SELECT,
  });
  if (recorded?.count !== '0') return;
  for (const step of ternStory) {
    const email = demoPeople.find((person) => person.subject === step.subject)?.email ?? '';
    const user = await User.findOne({ where: { email }, rejectOnEmpty: true });
    if (step.kind === 'edit') await applyChange(sequelize, user, craftId, draftId, step);
    else if (step.kind === 'lock') await lockBaseline(sequelize, user, craftId, draftId, { label: step.label, note: step.note });
    else {
      const study = await openStudy(sequelize, user, craftId, draftId, { name: step.name, note: step.note });
      for (const change of step.changes) await applyChange(sequelize, user, craftId, study.id, change);
    }
  }
}
