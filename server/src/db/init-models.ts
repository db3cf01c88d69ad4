import type { Sequelize } from 'sequelize';
import { initAuditEvent } from '../audit/audit-event.model.js';
import { initSessionRecord } from '../auth/session-record.model.js';
import { initMachineToken, MachineToken } from '../people/machine-token.model.js';
import { initUser, User } from '../people/user.model.js';

/**
 * Initialises every model on the one Sequelize instance and wires all associations, in one place.
 * Each feature's `<entity>.model.ts` exports an `init<Entity>(sequelize)`; call it here.
 * Safe to call again with another instance (tests): `init` rebinds the class and resets its associations.
 */
export function initModels(sequelize: Sequelize): void {
  initUser(sequelize);
  initMachineToken(sequelize);
  initSessionRecord(sequelize);
  initAuditEvent(sequelize);

  MachineToken.belongsTo(User, { as: 'createdBy', foreignKey: 'createdByUserId' });
}
