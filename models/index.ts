import type { Sequelize } from "sequelize";
import { Assessment } from "./Assessment";
import { AuditEvent } from "./AuditEvent";
import { DatasetVersion } from "./DatasetVersion";
import { Membership } from "./Membership";
import { Photo } from "./Photo";
import { Plot } from "./Plot";
import { Site } from "./Site";
import { Treatment } from "./Treatment";
import { Trial } from "./Trial";
import { Upload } from "./Upload";
import { User } from "./User";
import { ReviewComment } from "./ReviewComment";
import { ReviewRequest } from "./ReviewRequest";
import { Follow } from "./Follow";
import { TrialSummary } from "./TrialSummary";
import { Invitation } from "./Invitation";
import { MailMessage } from "./MailMessage";
import { NotificationDigestItem } from "./NotificationDigestItem";
import { NotificationSetting } from "./NotificationSetting";
import { PasswordResetToken } from "./PasswordResetToken";

export { Assessment, AuditEvent, DatasetVersion, Membership, Photo, Plot, Site, Treatment, Trial, Upload, User };
export { Follow, TrialSummary };
export { Invitation, MailMessage, NotificationDigestItem, NotificationSetting, PasswordResetToken };
export { ReviewComment, ReviewRequest };

const initializedWith = new WeakSet<Sequelize>();

/**
 * Binds these model classes to a connection. Next bundles a module once per route, so each
 * copy of this module binds its own classes to the one shared connection, once.
 */
export function initModels(sequelize: Sequelize): void {
  if (initializedWith.has(sequelize)) return;
  initializedWith.add(sequelize);
  User.initModel(sequelize);
  Site.initModel(sequelize);
  Trial.initModel(sequelize);
  Membership.initModel(sequelize);
  Treatment.initModel(sequelize);
  Plot.initModel(sequelize);
  Assessment.initModel(sequelize);
  Upload.initModel(sequelize);
  DatasetVersion.initModel(sequelize);
  AuditEvent.initModel(sequelize);
  Photo.initModel(sequelize);
  ReviewRequest.initModel(sequelize);
  ReviewComment.initModel(sequelize);
  TrialSummary.initModel(sequelize);
  Follow.initModel(sequelize);
  MailMessage.initModel(sequelize);
  Invitation.initModel(sequelize);
  PasswordResetToken.initModel(sequelize);
  NotificationSetting.initModel(sequelize);
  NotificationDigestItem.initModel(sequelize);

  Trial.belongsTo(Site, { as: "site", foreignKey: "siteId" });
  Trial.belongsTo(User, { as: "owner", foreignKey: "ownerId" });
  Trial.hasMany(Membership, { as: "memberships", foreignKey: "trialId" });
  Membership.belongsTo(User, { as: "user", foreignKey: "userId" });
  Membership.belongsTo(Trial, { as: "trial", foreignKey: "trialId" });
  Trial.hasMany(Treatment, { as: "treatments", foreignKey: "trialId" });
  Trial.hasMany(Plot, { as: "plots", foreignKey: "trialId" });
  Trial.hasMany(Assessment, { as: "assessments", foreignKey: "trialId" });
  Treatment.belongsTo(Trial, { as: "trial", foreignKey: "trialId" });
  Plot.belongsTo(Trial, { as: "trial", foreignKey: "trialId" });
  Plot.belongsTo(Treatment, { as: "treatment", foreignKey: "treatmentId" });
  Assessment.belongsTo(Trial, { as: "trial", foreignKey: "trialId" });
  DatasetVersion.belongsTo(User, { as: "createdBy", foreignKey: "createdById" });
  DatasetVersion.belongsTo(Upload, { as: "upload", foreignKey: "uploadId" });
  Upload.belongsTo(User, { as: "uploadedBy", foreignKey: "uploadedById" });
  AuditEvent.belongsTo(User, { as: "user", foreignKey: "userId" });
  Photo.belongsTo(Plot, { as: "plot", foreignKey: "plotId" });
  ReviewComment.belongsTo(User, { as: "author", foreignKey: "authorId" });
  ReviewRequest.belongsTo(User, { as: "requestedBy", foreignKey: "requestedById" });
  Invitation.belongsTo(Trial, { as: "trial", foreignKey: "trialId" });
  Invitation.belongsTo(User, { as: "invitedBy", foreignKey: "invitedById" });
}
