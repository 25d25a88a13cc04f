import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

/**
 * Which flow direction an element calibration is for (issue 13 §11): a bi-directional meter run has
 * a curve per direction, and a reverse calibration goes into the configuration version's
 * reverseElement. The record says so itself, rather than leaving it to be inferred from the version
 * it made. Every calibration recorded before was of the forward constants, hence the default.
 */
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    ALTER TABLE element_calibrations ADD COLUMN direction text NOT NULL DEFAULT 'forward'
      CONSTRAINT element_calibrations_direction CHECK (direction IN ('forward', 'reverse'));
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`ALTER TABLE element_calibrations DROP COLUMN direction;`);
};
