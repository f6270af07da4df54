import type { Sequelize } from "sequelize";
import { Area } from "./area";
import { Asset } from "./asset";
import { Changeover } from "./changeover";
import { CompatibilitySettingsRow } from "./compatibility-settings";
import { Grease } from "./grease";
import { GreaseDocument } from "./grease-document";
import { GreasePack } from "./grease-pack";
import { GreaseGun } from "./grease-gun";
import { GreasePairEvidence } from "./grease-pair-evidence";
import { IdempotencyKey } from "./idempotency-key";
import { LubePoint } from "./lube-point";
import { MailOutbox } from "./mail-outbox";
import { MixingIncident } from "./mixing-incident";
import { ServiceRecord } from "./service-record";
import { SignInThrottle } from "./sign-in-throttle";
import { Site } from "./site";
import { StoredDocument } from "./stored-document";
import { Supplier } from "./supplier";
import { User } from "./user";
import { UserInvitation } from "./user-invitation";
import { UserSession } from "./user-session";
import { UserSiteAccess } from "./user-site-access";

export {
  Area,
  Asset,
  Changeover,
  CompatibilitySettingsRow,
  Grease,
  GreaseDocument,
  GreasePack,
  GreaseGun,
  GreasePairEvidence,
  IdempotencyKey,
  LubePoint,
  MailOutbox,
  MixingIncident,
  ServiceRecord,
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
  Area.initModel(sequelize);
  Asset.initModel(sequelize);
  GreaseGun.initModel(sequelize);
  LubePoint.initModel(sequelize);
  Changeover.initModel(sequelize);
  ServiceRecord.initModel(sequelize);
  MixingIncident.initModel(sequelize);
  IdempotencyKey.initModel(sequelize);

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

  Site.hasMany(Area, { foreignKey: "siteId", as: "areas" });
  Area.hasMany(Asset, { foreignKey: "areaId", as: "assets" });
  Asset.belongsTo(Area, { foreignKey: "areaId", as: "area" });
  Asset.hasMany(LubePoint, { foreignKey: "assetId", as: "points" });
  LubePoint.belongsTo(Asset, { foreignKey: "assetId", as: "asset" });
  LubePoint.belongsTo(Grease, { foreignKey: "assignedGreaseId", as: "assignedGrease" });
  LubePoint.belongsTo(Grease, { foreignKey: "currentGreaseId", as: "currentGrease" });
  LubePoint.hasMany(ServiceRecord, { foreignKey: "pointId", as: "services" });
  LubePoint.hasMany(Changeover, { foreignKey: "pointId", as: "changeovers" });
  ServiceRecord.belongsTo(LubePoint, { foreignKey: "pointId", as: "point" });
  MixingIncident.belongsTo(LubePoint, { foreignKey: "pointId", as: "point" });
}
