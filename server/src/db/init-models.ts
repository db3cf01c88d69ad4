import type { Sequelize } from 'sequelize';
import { initAuditEvent } from '../audit/audit-event.model.js';
import { initSessionRecord } from '../auth/session-record.model.js';
import { initMachineToken, MachineToken } from '../people/machine-token.model.js';
import { initUser, User } from '../people/user.model.js';
import { initJob } from '../jobs/job.model.js';
import { initMailMessage } from '../mail/mail-message.model.js';
import { initDistributionList, DistributionList, DistributionRecipient } from '../releases/distribution-list.model.js';
import { initRelease } from '../releases/release.model.js';
import { initIdempotencyRecord } from '../runs/idempotency-record.model.js';
import { initRunAttempt } from '../runs/run-attempt.model.js';
import { initRunInput } from '../runs/run-input.model.js';
import { initRunResult } from '../runs/run-result.model.js';
import { initRun } from '../runs/run.model.js';
import { initSpecRevision } from '../specs/spec-revision.model.js';
import { initSpec } from '../specs/spec.model.js';
import { initUpload } from '../uploads/upload.model.js';

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
  MachineToken.belongsTo(User, { as: 'owner', foreignKey: 'ownerUserId' });

  initJob(sequelize);
  initSpec(sequelize);
  initSpecRevision(sequelize);
  initRun(sequelize);
  initRunAttempt(sequelize);
  initRunInput(sequelize);
  initRunResult(sequelize);
  initIdempotencyRecord(sequelize);
  initUpload(sequelize);
  initDistributionList(sequelize);
  initRelease(sequelize);
  initMailMessage(sequelize);
  DistributionList.hasMany(DistributionRecipient, { as: 'recipients', foreignKey: 'listId' });
}
