import type { Sequelize } from 'sequelize';
import { recordAudit, type AuditActor } from '../audit/audit.service.js';
import { hashPassword } from '../auth/passwords.js';
import type { Role } from '../auth/principal.js';
import { personDto } from './people.service.js';
import { User } from './user.model.js';

export interface DemoPerson {
  userName: string;
  displayName: string;
  role: Role;
  password: string;
}

/**
 * The invented people of the demo, one per role plus a second supervisor (so four eyes can be shown:
 * one supervisor authors a spec revision, the other releases). Demo passwords only: `demo-<role>-pass`.
 */
export const DEMO_PEOPLE: readonly DemoPerson[] = [
  { userName: 'ada.ops', displayName: 'Ada Quill', role: 'ops', password: 'demo-ops-pass' },
  { userName: 'ben.analyst', displayName: 'Ben Harrow', role: 'analyst', password: 'demo-analyst-pass' },
  { userName: 'cleo.supervisor', displayName: 'Cleo Fenwick', role: 'supervisor', password: 'demo-supervisor-pass' },
  { userName: 'finn.supervisor', displayName: 'Finn Calder', role: 'supervisor', password: 'demo-supervisor-pass' },
  { userName: 'dev.admin', displayName: 'Dev Marsh', role: 'admin', password: 'demo-admin-pass' },
  { userName: 'eve.viewer', displayName: 'Eve Tolland', role: 'viewer', password: 'demo-viewer-pass' },
];

export const DEMO_SEED_ACTOR: AuditActor = { kind: 'system', name: 'demo-seed' };

/** Creates the demo people who do not exist yet (by user name); leaves existing ones as they are. */
export async function seedDemoPeople(sequelize: Sequelize, hashRounds: number): Promise<string[]> {
  const created: string[] = [];
  for (const person of DEMO_PEOPLE) {
    if (await User.findOne({ where: { userName: person.userName } })) continue;
    const passwordHash = await hashPassword(person.password, hashRounds);
    await sequelize.transaction(async (transaction) => {
      const user = await User.create({ userName: person.userName, displayName: person.displayName, email: `${person.userName}@demo-fund.invalid`, role: person.role, passwordHash }, { transaction });
      await recordAudit(transaction, { actor: DEMO_SEED_ACTOR, action: 'person.create', entityType: 'person', entityId: user.id, after: personDto(user) });
    });
    created.push(person.userName);
  }
  return created;
}
