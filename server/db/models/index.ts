import type { Sequelize } from 'sequelize';
import { Attachment } from './attachment.model.ts';
import { AuditEvent } from './audit-event.model.ts';
import { BenchPhoto, BenchRecord } from './bench-record.model.ts';
import { Connector } from './connector.model.ts';
import { Conversion } from './conversion.model.ts';
import { Feed, FeedLoad } from './feed.model.ts';
import { ImportMapping, PinImport } from './import.model.ts';
import { Invitation, MailOutbox } from './mail.model.ts';
import { ReviewComment, ReviewCommentAnswer, Revision } from './revision.model.ts';
import { Pin } from './pin.model.ts';
import { PinoutTemplate, PinoutTemplatePin } from './pinout-template.model.ts';
import { User } from './user.model.ts';
import { Workshop } from './workshop.model.ts';

export {
  Attachment,
  AuditEvent,
  BenchPhoto,
  BenchRecord,
  Connector,
  Conversion,
  Feed,
  FeedLoad,
  ImportMapping,
  Invitation,
  MailOutbox,
  Pin,
  PinImport,
  PinoutTemplate,
  PinoutTemplatePin,
  ReviewComment,
  ReviewCommentAnswer,
  Revision,
  User,
  Workshop,
};

/**
 * Binds the model classes to one database. Sequelize model classes are process-wide, so a process
 * (and a test file) works with one database at a time.
 */
export function initModels(sequelize: Sequelize) {
  Workshop.initModel(sequelize);
  User.initModel(sequelize);
  Conversion.initModel(sequelize);
  AuditEvent.initModel(sequelize);
  Connector.initModel(sequelize);
  Pin.initModel(sequelize);
  Feed.initModel(sequelize);
  FeedLoad.initModel(sequelize);
  Revision.initModel(sequelize);
  ReviewComment.initModel(sequelize);
  ReviewCommentAnswer.initModel(sequelize);
  MailOutbox.initModel(sequelize);
  Invitation.initModel(sequelize);
  BenchRecord.initModel(sequelize);
  BenchPhoto.initModel(sequelize);
  PinImport.initModel(sequelize);
  ImportMapping.initModel(sequelize);
  PinoutTemplate.initModel(sequelize);
  PinoutTemplatePin.initModel(sequelize);
  Attachment.initModel(sequelize);

  Workshop.hasMany(User, { foreignKey: 'workshopId' });
  User.belongsTo(Workshop, { foreignKey: 'workshopId' });
  Workshop.hasMany(Conversion, { foreignKey: 'workshopId' });
  Conversion.belongsTo(Workshop, { foreignKey: 'workshopId' });
  Conversion.belongsTo(User, { as: 'createdBy', foreignKey: 'createdById' });
  Conversion.hasMany(Connector, { foreignKey: 'conversionId' });
  Connector.belongsTo(Conversion, { foreignKey: 'conversionId' });
  Connector.hasMany(Pin, { foreignKey: 'connectorId' });
  Pin.belongsTo(Connector, { foreignKey: 'connectorId' });
  Pin.belongsTo(Conversion, { foreignKey: 'conversionId' });
  Conversion.hasMany(Feed, { foreignKey: 'conversionId' });
  Feed.belongsTo(Conversion, { foreignKey: 'conversionId' });
  Feed.hasMany(FeedLoad, { as: 'loads', foreignKey: 'feedId' });
  FeedLoad.belongsTo(Feed, { foreignKey: 'feedId' });
  Revision.hasMany(ReviewComment, { as: 'comments', foreignKey: 'revisionId' });
  PinoutTemplate.hasMany(PinoutTemplatePin, { as: 'pins', foreignKey: 'templateId' });
  PinoutTemplate.belongsTo(User, { as: 'createdBy', foreignKey: 'createdById' });
}
