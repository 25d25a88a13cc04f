import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

/**
 * Certificates and due dates for a primary element's care records (issue 11 §3, §4).
 *
 * - Element calibrations, gas analyses and inspections may carry an uploaded certificate, kept
 *   as transmitter calibrations keep theirs (server/certificates/store.ts: path relative to the
 *   data folder, SHA-256, type judged by content, size, the uploader's file name). The existing
 *   `certificate` column stays what it was: the laboratory's certificate number or reference.
 * - Each may name when the next one is due (`next_due`, a date in the site's calendar); the
 *   per-site "what is due" list and the due and overdue alarms read the latest record's.
 *
 * Adding columns is a change of the table, not of its rows: the append-only triggers stay, and
 * rows recorded before this migration read NULL (no file, no due date).
 */
const certificateColumns = (table: string) => `
    ALTER TABLE ${table}
      ADD COLUMN certificate_path       text,
      ADD COLUMN certificate_sha256     text CHECK (certificate_sha256 ~ '^[0-9a-f]{64}$'),
      ADD COLUMN certificate_type       text CHECK (certificate_type IN ('application/pdf', 'image/png', 'image/jpeg')),
      ADD COLUMN certificate_size_bytes bigint,
      ADD COLUMN certificate_name       text,
      ADD COLUMN next_due               date,
      ADD CONSTRAINT ${table}_certificate_whole CHECK ((certificate_path IS NULL) = (certificate_sha256 IS NULL));`;

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    ${certificateColumns('element_calibrations')}
    ${certificateColumns('gas_analyses')}
    ${certificateColumns('element_inspections')}
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  const drop = (table: string) => `
    ALTER TABLE ${table}
      DROP CONSTRAINT ${table}_certificate_whole,
      DROP COLUMN certificate_path, DROP COLUMN certificate_sha256, DROP COLUMN certificate_type,
      DROP COLUMN certificate_size_bytes, DROP COLUMN certificate_name, DROP COLUMN next_due;`;
  await qi.sequelize.query(`${drop('element_calibrations')} ${drop('gas_analyses')} ${drop('element_inspections')}`);
};
