import type { Sequelize } from 'sequelize';
import { AccessToken } from './access-token';
import { AllowanceTable } from './allowance-table';
import { Attachment } from './attachment';
import { Craft } from './craft';
import { Identity } from './identity';
import { Import } from './import';
import { Invitation } from './invitation';
import { Membership } from './membership';
import { Organisation } from './organisation';
import { Revision } from './revision';
import { Subsystem } from './subsystem';
import { User } from './user';

export { AccessToken, AllowanceTable, Attachment, Craft, Identity, Import, Invitation, Membership, Organisation, Revision, Subsystem, User };

/** Registers every model on the connection and sets up all associations, in this one place. */
export function initModels(sequelize: Sequelize): void {
  for (const model of [Organisation, User, Identity, Craft, Membership, Invitation, Subsystem, Revision, AccessToken, Attachment, Import, AllowanceTable])
    model.initModel(sequelize);

  Organisation.hasMany(User, { foreignKey: 'organisationId', as: 'users' });
  User.belongsTo(Organisation, { foreignKey: 'organisationId', as: 'organisation' });
  User.hasMany(Identity, { foreignKey: 'userId', as: 'identities' });
  Identity.belongsTo(User, { foreignKey: 'userId', as: 'user' });
  Organisation.hasMany(Craft, { foreignKey: 'organisationId', as: 'crafts' });
  Craft.belongsTo(Organisation, { foreignKey: 'organisationId', as: 'organisation' });
  Craft.belongsTo(User, { foreignKey: 'createdById', as: 'createdBy' });
  Craft.hasMany(Membership, { foreignKey: 'craftId', as: 'memberships' });
  Membership.belongsTo(Craft, { foreignKey: 'craftId', as: 'craft' });
  User.hasMany(Membership, { foreignKey: 'userId', as: 'memberships' });
  Membership.belongsTo(User, { foreignKey: 'userId', as: 'user' });
  Organisation.hasMany(Invitation, { foreignKey: 'organisationId', as: 'invitations' });
  Invitation.belongsTo(User, { foreignKey: 'invitedById', as: 'invitedBy' });
  Craft.hasMany(Subsystem, { foreignKey: 'craftId', as: 'subsystems' });
  Craft.hasMany(Revision, { foreignKey: 'craftId', as: 'revisions' });
  Revision.belongsTo(Craft, { foreignKey: 'craftId', as: 'craft' });
  Revision.belongsTo(User, { foreignKey: 'createdById', as: 'createdBy' });
  Revision.belongsTo(User, { foreignKey: 'lockedById', as: 'lockedBy' });
  User.hasMany(AccessToken, { foreignKey: 'userId', as: 'accessTokens' });
  AccessToken.belongsTo(User, { foreignKey: 'userId', as: 'user' });
  Import.belongsTo(Revision, { foreignKey: 'revisionId', as: 'revision' });
  Import.belongsTo(User, { foreignKey: 'createdById', as: 'createdBy' });
  Craft.hasMany(Import, { foreignKey: 'craftId', as: 'imports' });
  Craft.hasMany(Attachment, { foreignKey: 'craftId', as: 'attachments' });
  Attachment.belongsTo(User, { foreignKey: 'uploadedById', as: 'uploadedBy' });
  Craft.hasOne(AllowanceTable, { foreignKey: 'craftId', as: 'allowanceTable' });
  AllowanceTable.belongsTo(User, { foreignKey: 'updatedById', as: 'updatedBy' });
}
