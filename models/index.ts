import type { Sequelize } from "sequelize";
import { MailOutbox } from "./mail-outbox";
import { SignInThrottle } from "./sign-in-throttle";
import { Site } from "./site";
import { User } from "./user";
import { UserInvitation } from "./user-invitation";
import { UserSession } from "./user-session";
import { UserSiteAccess } from "./user-site-access";

export { MailOutbox, SignInThrottle, Site, User, UserInvitation, UserSession, UserSiteAccess };
export type { UserStatus, UnitSystem } from "./user";
export type { OutboxStatus } from "./mail-outbox";

const initialised = new WeakSet<Sequelize>();

/** Registers every model and association on a Sequelize instance (once per instance). */
export function initModels(sequelize: Sequelize): void {
  if (initialised.has(sequelize)) return;
  initialised.add(sequelize);

  User.initModel(sequelize);
  UserSession.initModel(sequelize);
  Site.initModel(sequelize);
  UserSiteAccess.initModel(sequelize);
  MailOutbox.initModel(sequelize);
  SignInThrottle.initModel(sequelize);
  UserInvitation.initModel(sequelize);

  User.hasMany(UserSession, { foreignKey: "userId", as: "sessions" });
  UserSession.belongsTo(User, { foreignKey: "userId", as: "user" });
  User.belongsToMany(Site, { through: UserSiteAccess, foreignKey: "userId", otherKey: "siteId", as: "sites" });
  Site.belongsToMany(User, { through: UserSiteAccess, foreignKey: "siteId", otherKey: "userId", as: "users" });
  User.hasMany(UserInvitation, { foreignKey: "userId", as: "invitations" });
  UserInvitation.belongsTo(User, { foreignKey: "userId", as: "user" });
}
