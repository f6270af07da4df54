import type { Sequelize } from "sequelize";
import { CompatibilitySettingsRow } from "./compatibility-settings";
import { Grease } from "./grease";
import { GreaseDocument } from "./grease-document";
import { GreasePack } from "./grease-pack";
import { GreasePairEvidence } from "./grease-pair-evidence";
import { MailOutbox } from "./mail-outbox";
import { SignInThrottle } from "./sign-in-throttle";
import { Site } from "./site";
import { StoredDocument } from "./stored-document";
import { Supplier } from "./supplier";
import { User } from "./user";
import { UserInvitation } from "./user-invitation";
import { UserSession } from "./user-session";
import { UserSiteAccess } from "./user-site-access";

export {
  CompatibilitySettingsRow,
  Grease,
  GreaseDocument,
  GreasePack,
  GreasePairEvidence,
  MailOutbox,
  SignInThrottle,
  Site,
  StoredDocument,
  Supplier,
  User,
  UserInvitation,
  UserSession,
  UserSiteAccess,
};
export type { GreaseDocumentKind } from "./grease-document";
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
  Supplier.initModel(sequelize);
  Grease.initModel(sequelize);
  GreasePack.initModel(sequelize);
  StoredDocument.initModel(sequelize);
  GreaseDocument.initModel(sequelize);
  GreasePairEvidence.initModel(sequelize);
  CompatibilitySettingsRow.initModel(sequelize);

  User.hasMany(UserSession, { foreignKey: "userId", as: "sessions" });
  UserSession.belongsTo(User, { foreignKey: "userId", as: "user" });
  User.belongsToMany(Site, { through: UserSiteAccess, foreignKey: "userId", otherKey: "siteId", as: "sites" });
  Site.belongsToMany(User, { through: UserSiteAccess, foreignKey: "siteId", otherKey: "userId", as: "users" });
  User.hasMany(UserInvitation, { foreignKey: "userId", as: "invitations" });
  UserInvitation.belongsTo(User, { foreignKey: "userId", as: "user" });

  Supplier.hasMany(Grease, { foreignKey: "supplierId", as: "greases" });
  Grease.belongsTo(Supplier, { foreignKey: "supplierId", as: "supplier" });
  Grease.hasMany(GreasePack, { foreignKey: "greaseId", as: "packs" });
  GreasePack.belongsTo(Grease, { foreignKey: "greaseId", as: "grease" });
  Grease.hasMany(GreaseDocument, { foreignKey: "greaseId", as: "documents" });
  GreaseDocument.belongsTo(StoredDocument, { foreignKey: "documentId", as: "document" });
  GreasePairEvidence.belongsTo(Grease, { foreignKey: "greaseLowId", as: "greaseLow" });
  GreasePairEvidence.belongsTo(Grease, { foreignKey: "greaseHighId", as: "greaseHigh" });
  GreasePairEvidence.belongsTo(StoredDocument, { foreignKey: "documentId", as: "document" });
  Site.hasOne(CompatibilitySettingsRow, { foreignKey: "siteId", as: "compatibilitySettings" });
}
