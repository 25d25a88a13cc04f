import type { Sequelize } from 'sequelize';
import { User } from './user';
import { AuditEvent } from './audit-event';
import { MailMessage } from './mail-message';

export { User, AuditEvent, MailMessage };

/** Binds every model to the connection; call once per process before using them. */
export function initModels(sequelize: Sequelize) {
  User.initModel(sequelize);
  AuditEvent.initModel(sequelize);
  MailMessage.initModel(sequelize);
}
