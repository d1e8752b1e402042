import type { Sequelize } from 'sequelize';
import { User } from './user';
import { Garden } from './garden';
import { Membership } from './membership';
import { Session } from './session';

export { User, Garden, Membership, Session };

let initialised: Sequelize | null = null;

/** Binds the model classes to one Sequelize instance (one per process; tests may rebind). */
export function initModels(sequelize: Sequelize) {
  if (initialised === sequelize) return;
  User.initModel(sequelize);
  Garden.initModel(sequelize);
  Membership.initModel(sequelize);
  Session.initModel(sequelize);
  Membership.belongsTo(User, { foreignKey: 'userId', as: 'user' });
  Membership.belongsTo(Garden, { foreignKey: 'gardenId', as: 'garden' });
  Garden.hasMany(Membership, { foreignKey: 'gardenId', as: 'memberships' });
  User.hasMany(Membership, { foreignKey: 'userId', as: 'memberships' });
  initialised = sequelize;
}
