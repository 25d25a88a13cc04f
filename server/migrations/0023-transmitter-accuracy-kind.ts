import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

/**
 * What kind of figure a transmitter's datasheet accuracy is (issue 13 §8): 'expanded-k2', an
 * expanded uncertainty with coverage factor 2 (GUM §6.2), or 'rectangular-limit', a ± limit taken as
 * rectangular, u = a/√3 (GUM §4.3.7). It is part of the dated range setting (0007), so changing it
 * is a new version from a date and never rewrites the hours before; the transmitter row keeps the
 * latest value like its other columns. Every existing figure was used as k = 2, so that is the default.
 */
const kindColumn = `accuracy_kind text NOT NULL DEFAULT 'expanded-k2'
  CHECK (accuracy_kind IN ('expanded-k2', 'rectangular-limit'))`;

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    ALTER TABLE transmitters ADD COLUMN ${kindColumn};
    ALTER TABLE transmitter_range_versions ADD COLUMN ${kindColumn};
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    ALTER TABLE transmitter_range_versions DROP COLUMN accuracy_kind;
    ALTER TABLE transmitters DROP COLUMN accuracy_kind;
  `);
};
