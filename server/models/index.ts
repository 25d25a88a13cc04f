import type { Sequelize } from 'sequelize';
import { User } from './user';
import { AuditEvent } from './audit-event';
import { MailMessage } from './mail-message';
import { Site } from './site';
import { MeterRun, ConfigVersion } from './meter-run';
import { Transmitter } from './transmitter';
import { Device } from './device';

export { User, AuditEvent, MailMessage, Site, MeterRun, ConfigVersion, Transmitter, Device };

/** Binds every model to the connection; call once per process before using them. */
export function initModels(sequelize: Sequelize) {
  for (const model of [User, AuditEvent, MailMessage, Site, MeterRun, ConfigVersion, Transmitter, Device])
    model.initModel(sequelize);
}
