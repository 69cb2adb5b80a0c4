import { sequelize } from '../db/sequelize';
import { BillingEvent } from './BillingEvent';
import { AuditEvent } from './AuditEvent';
import { Design } from './Design';
import { DesignVersion } from './DesignVersion';
import { DesignTakeoff, Estimate, EstimateAuditEntry } from './Estimate';
import { Firm } from './Firm';
import { Invitation } from './Invitation';
import { PasswordReset } from './PasswordReset';
import { PriceBook } from './PriceBook';
import { PriceBookItem } from './PriceBookItem';
import { Project } from './Project';
import { Proposal } from './Proposal';
import { ProposalEmail } from './ProposalEmail';
import { ReviewerCredential } from './ReviewerCredential';
import { SignupRequest } from './SignupRequest';
import { User } from './User';

// Init every model on the process pool first, then wire the associations.
Firm.initModel(sequelize);
User.initModel(sequelize);
Project.initModel(sequelize);
Invitation.initModel(sequelize);
PasswordReset.initModel(sequelize);
Design.initModel(sequelize);
SignupRequest.initModel(sequelize);
BillingEvent.initModel(sequelize);
DesignVersion.initModel(sequelize);
ReviewerCredential.initModel(sequelize);
AuditEvent.initModel(sequelize);
Proposal.initModel(sequelize);
ProposalEmail.initModel(sequelize);
PriceBook.initModel(sequelize);
PriceBookItem.initModel(sequelize);
Estimate.initModel(sequelize);
EstimateAuditEntry.initModel(sequelize);
DesignTakeoff.initModel(sequelize);

Firm.hasMany(User, { as: 'users', foreignKey: 'firmId' });
User.belongsTo(Firm, { as: 'firm', foreignKey: 'firmId' });
Firm.hasMany(Project, { as: 'projects', foreignKey: 'firmId' });
Project.belongsTo(Firm, { as: 'firm', foreignKey: 'firmId' });
Project.belongsTo(User, { as: 'createdBy', foreignKey: 'createdById' });
Firm.hasMany(Invitation, { as: 'invitations', foreignKey: 'firmId' });
Invitation.belongsTo(Firm, { as: 'firm', foreignKey: 'firmId' });
Invitation.belongsTo(User, { as: 'invitedBy', foreignKey: 'invitedById' });
PasswordReset.belongsTo(User, { as: 'user', foreignKey: 'userId' });
Project.hasOne(Design, { as: 'design', foreignKey: 'projectId' });
Design.belongsTo(Project, { as: 'project', foreignKey: 'projectId' });
Design.belongsTo(User, { as: 'updatedBy', foreignKey: 'updatedById' });
Design.hasMany(DesignVersion, { as: 'versions', foreignKey: 'designId' });
DesignVersion.belongsTo(Project, { as: 'project', foreignKey: 'projectId' });
User.hasOne(ReviewerCredential, { as: 'reviewer', foreignKey: 'userId' });
ReviewerCredential.belongsTo(User, { as: 'user', foreignKey: 'userId' });
Proposal.hasMany(ProposalEmail, { as: 'emails', foreignKey: 'proposalId' });
Firm.hasMany(PriceBook, { as: 'priceBooks', foreignKey: 'firmId' });
PriceBook.belongsTo(User, { as: 'createdBy', foreignKey: 'createdById' });
PriceBook.hasMany(PriceBookItem, { as: 'items', foreignKey: 'priceBookId' });

export {
  sequelize,
  AuditEvent,
  BillingEvent,
  Design,
  DesignTakeoff,
  DesignVersion,
  Estimate,
  EstimateAuditEntry,
  Firm,
  Invitation,
  PasswordReset,
  PriceBook,
  PriceBookItem,
  Project,
  Proposal,
  ProposalEmail,
  ReviewerCredential,
  SignupRequest,
  User,
};
