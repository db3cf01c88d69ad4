import type { MigrationFn } from 'umzug';
import type { MigrationContext } from '../migrator.js';
import * as m0001 from './0001-instance-settings.js';

interface MigrationModule {
  up: MigrationFn<MigrationContext>;
  down: MigrationFn<MigrationContext>;
}

/** Every migration, in the order it applies. Add a new file here with the next number. */
export const migrations: readonly { name: string; module: MigrationModule }[] = [
  { name: '0001-instance-settings', module: m0001 },
];
