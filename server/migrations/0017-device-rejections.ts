import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

/**
 * Why a device's readings were refused (issue 12 §12). Before this, a device kept one text: the
 * first reason of its latest refused message, overwritten by the next. Now:
 *
 * - `device_rejections`: a bounded log per device, the latest 100 refusals (time, topic, a reason
 *   kind, the reason, and the reading's index in the message when one reading was refused). The
 *   ingest path writes it in batches and prunes each device to 100 rows in the same statement,
 *   so the table stays at most 100 rows per device. It is a working log, not a record: pruning
 *   deletes rows, so it carries no append-only trigger.
 * - `device_rejection_counts`: how many refusals of each kind a device has had since the count
 *   began (`since`, the first refusal of that kind counted), added to with every batch.
 *
 * Both go with their device (ON DELETE CASCADE; devices are disabled, not deleted, today).
 */
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE TABLE device_rejections (
      id            bigserial PRIMARY KEY,
      device_id     bigint NOT NULL REFERENCES devices(id) ON DELETE CASCADE,
      at            timestamptz NOT NULL,
      topic         text NOT NULL,
      reason_kind   text NOT NULL,
      reason        text NOT NULL,
      reading_index integer CHECK (reading_index >= 0)
    );
    CREATE INDEX device_rejections_device_latest ON device_rejections (device_id, id DESC);
    CREATE TABLE device_rejection_counts (
      device_id   bigint NOT NULL REFERENCES devices(id) ON DELETE CASCADE,
      reason_kind text NOT NULL,
      count       bigint NOT NULL CHECK (count >= 0),
      since       timestamptz NOT NULL DEFAULT now(),
      PRIMARY KEY (device_id, reason_kind)
    );
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query('DROP TABLE device_rejection_counts; DROP TABLE device_rejections;');
};
