import { QueryTypes } from 'sequelize';
import { Craft, User } from '@/server/models';
import { demoPeople } from '@/server/seed/demo-scenario';
import { createToken } from '@/server/services/access-tokens';
import type { TestApp } from '../helpers/test-app';
import type { Ids } from './route-cases';

/** The ids route-cases.ts fills its paths with, read from a fresh copy of the demo. */
export async function routeIds(testApp: TestApp): Promise<Ids> {
  const tern = await Craft.findOne({ where: { name: 'Tern' }, rejectOnEmpty: true });
  const byEmail = async (subject: string) => {
    const person = demoPeople.find((p) => p.subject === subject);
    return (await User.findOne({ where: { email: person?.email ?? '' }, rejectOnEmpty: true })).id;
  };
  const tomas = await User.findByPk(await byEmail('demo-tomas'), { rejectOnEmpty: true });
  const [draft] = await testApp.sequelize.query<{ id: string }>(`SELECT id FROM revisions WHERE craft_id = $1 AND kind = 'draft'`, {
    bind: [tern.id],
    type: QueryTypes.SELECT,
  });
  const revisionOf = async (kind: 'baseline' | 'study') => {
    const [found] = await testApp.sequelize.query<{ id: string }>(`SELECT id FROM revisions WHERE craft_id = $1 AND kind = $2`, {
      bind: [tern.id, kind],
      type: QueryTypes.SELECT,
    });
    return found?.id ?? '';
  };
  const [optics] = await testApp.sequelize.query<{ id: string }>(`SELECT id FROM subsystems WHERE craft_id = $1 AND name = 'Optics'`, {
    bind: [tern.id],
    type: QueryTypes.SELECT,
  });
  return {
    craftId: tern.id,
    revisionId: draft?.id ?? '',
    baselineId: await revisionOf('baseline'),
    studyId: await revisionOf('study'),
    subsystemId: optics?.id ?? '',
    ines: await byEmail('demo-ines'),
    tomas: tomas.id,
    tokenId: (await createToken(tomas, { name: 'Matrix token', scope: 'read' })).token.id,
  };
}
