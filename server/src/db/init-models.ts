import type { Sequelize } from 'sequelize';

/**
 * Initialises every model on the one Sequelize instance and wires all associations, in one place.
 * Each feature's `<entity>.model.ts` exports an `init<Entity>(sequelize)`; call it here.
 */
export function initModels(sequelize: Sequelize): void {
  void sequelize;
}
