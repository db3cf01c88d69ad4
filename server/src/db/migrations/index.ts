import type { MigrationFn } from 'umzug';
import type { MigrationContext } from '../migrator.js';
import * as m0001 from './0001-instance-settings.js';
import * as m0002 from './0002-users.js';
import * as m0003 from './0003-machine-tokens.js';
import * as m0004 from './0004-sessions.js';
import * as m0005 from './0005-audit-events.js';
import * as m0006 from './0006-unique-user-names-and-token-hashes.js';
import * as m0010 from './0010-jobs.js';
import * as m0011 from './0011-specs.js';
import * as m0012 from './0012-runs.js';
import * as m0013 from './0013-run-results.js';
import * as m0014 from './0014-uploads.js';
import * as m0015 from './0015-distribution-lists.js';
import * as m0016 from './0016-releases.js';
import * as m0017 from './0017-mail-messages.js';
import * as m0018 from './0018-machine-token-owners.js';

interface MigrationModule {
  up: MigrationFn<MigrationContext>;
  down: MigrationFn<MigrationContext>;
}

/** Every migration, in the order it applies. Add a new file here with the next number. */
export const migrations: readonly { name: string; module: MigrationModule }[] = [
  { name: '0001-instance-settings', module: m0001 },
  { name: '0002-users', module: m0002 },
  { name: '0003-machine-tokens', module: m0003 },
  { name: '0004-sessions', module: m0004 },
  { name: '0005-audit-events', module: m0005 },
  { name: '0006-unique-user-names-and-token-hashes', module: m0006 },
  { name: '0010-jobs', module: m0010 },
  { name: '0011-specs', module: m0011 },
  { name: '0012-runs', module: m0012 },
  { name: '0013-run-results', module: m0013 },
  { name: '0014-uploads', module: m0014 },
  { name: '0015-distribution-lists', module: m0015 },
  { name: '0016-releases', module: m0016 },
  { name: '0017-mail-messages', module: m0017 },
  { name: '0018-machine-token-owners', module: m0018 },
];
