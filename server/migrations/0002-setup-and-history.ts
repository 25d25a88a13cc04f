import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

/**
 * Sites, meter runs with effective-dated configuration versions, transmitters, device
 * credentials, readings (range-partitioned by month), imports, hourly records and the
 * contract-day and monthly rollups.
 */
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE TABLE sites (
      id                      bigint GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
      code                    text NOT NULL UNIQUE,
      name                    text NOT NULL,
      time_zone               text NOT NULL,
      contract_hour           smallint NOT NULL CHECK (contract_hour BETWEEN 0 AND 23),
      base_pressure_pa        double precision NOT NULL,
      base_temperature_k      double precision NOT NULL,
      atmospheric_pressure_pa double precision NOT NULL,
      display_units           text NOT NULL DEFAULT 'si',
      created_at              timestamptz NOT NULL DEFAULT now(),
      updated_at              timestamptz NOT NULL DEFAULT now()
    );

    CREATE TABLE meter_runs (
      id             bigint GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
      site_id        bigint NOT NULL REFERENCES sites (id),
      tag            text NOT NULL UNIQUE,
      name           text NOT NULL,
      hold_limit_s   double precision NOT NULL DEFAULT 60,
      max_gap_s      double precision NOT NULL DEFAULT 300,
      -- stacked DP pair: switch to the high-range transmitter above this share of the low span, back below the lower one
      stack_switch_up_share   double precision NOT NULL DEFAULT 0.9,
      stack_switch_down_share double precision NOT NULL DEFAULT 0.8,
      line           jsonb NOT NULL DEFAULT '{}'::jsonb,
      created_at     timestamptz NOT NULL DEFAULT now(),
      updated_at     timestamptz NOT NULL DEFAULT now()
    );

    -- The element, fluid and constants of a meter run from a moment on (an element swap, a re-range).
    CREATE TABLE config_versions (
      id             bigint GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
      meter_run_id   bigint NOT NULL REFERENCES meter_runs (id),
      effective_from timestamptz NOT NULL,
      element        jsonb NOT NULL,
      fluid          jsonb NOT NULL,
      reason         text NOT NULL DEFAULT '',
      created_by     bigint REFERENCES users (id),
      created_at     timestamptz NOT NULL DEFAULT now(),
      UNIQUE (meter_run_id, effective_from)
    );

    CREATE TYPE transmitter_measure AS ENUM ('differential-pressure', 'static-pressure', 'temperature');
    CREATE TYPE stack_role AS ENUM ('single', 'low', 'high');
    CREATE TABLE transmitters (
      id                       bigint GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
      meter_run_id             bigint NOT NULL REFERENCES meter_runs (id),
      tag                      text NOT NULL UNIQUE,
      measures                 transmitter_measure NOT NULL,
      unit                     text NOT NULL,
      pressure_reference       text NOT NULL DEFAULT 'absolute' CHECK (pressure_reference IN ('absolute', 'gauge')),
      lower_range              double precision NOT NULL,
      upper_range              double precision NOT NULL,
      stack_role               stack_role NOT NULL DEFAULT 'single',
      accuracy_percent_of_span double precision NOT NULL DEFAULT 0.075,
      calibration_due          date,
      created_at               timestamptz NOT NULL DEFAULT now(),
      updated_at               timestamptz NOT NULL DEFAULT now(),
      CHECK (upper_range > lower_range)
    );
    CREATE INDEX transmitters_meter_run_idx ON transmitters (meter_run_id);

    CREATE TABLE devices (
      id             bigint GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
      site_id        bigint NOT NULL REFERENCES sites (id),
      name           text NOT NULL,
      username       text NOT NULL UNIQUE,
      password_hash  text NOT NULL,
      disabled       boolean NOT NULL DEFAULT false,
      rejected_count bigint NOT NULL DEFAULT 0,
      accepted_count bigint NOT NULL DEFAULT 0,
      last_rejection text,
      last_seen_at   timestamptz,
      created_at     timestamptz NOT NULL DEFAULT now()
    );

    -- One value of one transmitter at one time, in the transmitter's own unit. The primary key
    -- makes a redelivered MQTT message or a re-imported CSV row a duplicate, not a second reading.
    CREATE TABLE readings (
      transmitter_id bigint NOT NULL,
      time           timestamptz NOT NULL,
      value          double precision NOT NULL,
      quality        smallint NOT NULL DEFAULT 0, -- 0 good, 1 uncertain, 2 bad, 3 substituted
      source         smallint NOT NULL DEFAULT 0, -- 0 mqtt, 1 csv, 2 back-fill
      PRIMARY KEY (transmitter_id, time)
    ) PARTITION BY RANGE (time);
    -- Catches anything outside the monthly partitions, so no acknowledged reading is ever refused.
    CREATE TABLE readings_default PARTITION OF readings DEFAULT;

    CREATE TABLE imports (
      id            bigint GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
      kind          text NOT NULL CHECK (kind IN ('readings', 'field-totals')),
      filename      text NOT NULL,
      status        text NOT NULL DEFAULT 'running' CHECK (status IN ('running', 'done', 'failed')),
      bytes_total   bigint,
      bytes_read    bigint NOT NULL DEFAULT 0,
      rows_read     bigint NOT NULL DEFAULT 0,
      rows_imported bigint NOT NULL DEFAULT 0,
      duplicates    bigint NOT NULL DEFAULT 0,
      rejected      bigint NOT NULL DEFAULT 0,
      errors        jsonb NOT NULL DEFAULT '[]'::jsonb,
      created_by    bigint REFERENCES users (id),
      created_at    timestamptz NOT NULL DEFAULT now(),
      finished_at   timestamptz
    );

    CREATE TABLE field_totals (
      meter_run_id       bigint NOT NULL REFERENCES meter_runs (id),
      period_start       timestamptz NOT NULL,
      period_end         timestamptz NOT NULL,
      standard_volume_m3 double precision,
      mass_kg            double precision,
      energy_j           double precision,
      import_id          bigint REFERENCES imports (id),
      PRIMARY KEY (meter_run_id, period_start, period_end)
    );

    -- The quantity transaction record of an hour (API MPMS 21.1): unrounded, recomputable.
    CREATE TABLE hourly_records (
      meter_run_id          bigint NOT NULL REFERENCES meter_runs (id),
      start                 timestamptz NOT NULL,
      "end"                 timestamptz NOT NULL,
      flow_time_s           double precision NOT NULL,
      mass_kg               double precision NOT NULL,
      volume_m3             double precision NOT NULL,
      standard_volume_m3    double precision NOT NULL,
      energy_j              double precision,
      average_dp_pa         double precision,
      average_pressure_pa   double precision,
      average_temperature_k double precision,
      integral_value        double precision,
      coverage              double precision NOT NULL,
      flags                 text[] NOT NULL DEFAULT '{}',
      uncertainty_percent   double precision,
      config_version_id     bigint REFERENCES config_versions (id),
      -- time and mass in each band of the active DP transmitter's span (range health)
      dp_bands              jsonb NOT NULL DEFAULT '{}'::jsonb,
      active_transmitter_time jsonb NOT NULL DEFAULT '{}'::jsonb,
      final_stack_choice    text,
      computed_at           timestamptz NOT NULL DEFAULT now(),
      PRIMARY KEY (meter_run_id, start)
    );

    CREATE TABLE daily_totals (
      meter_run_id        bigint NOT NULL REFERENCES meter_runs (id),
      contract_day        date NOT NULL,
      start               timestamptz NOT NULL,
      "end"               timestamptz NOT NULL,
      hours               smallint NOT NULL,
      flow_time_s         double precision NOT NULL,
      mass_kg             double precision NOT NULL,
      volume_m3           double precision NOT NULL,
      standard_volume_m3  double precision NOT NULL,
      energy_j            double precision,
      coverage            double precision NOT NULL,
      flags               text[] NOT NULL DEFAULT '{}',
      uncertainty_percent double precision,
      status              text NOT NULL,
      computed_at         timestamptz NOT NULL DEFAULT now(),
      PRIMARY KEY (meter_run_id, contract_day)
    );

    CREATE TABLE monthly_totals (
      meter_run_id        bigint NOT NULL REFERENCES meter_runs (id),
      month               date NOT NULL,
      start               timestamptz NOT NULL,
      "end"               timestamptz NOT NULL,
      hours               smallint NOT NULL,
      flow_time_s         double precision NOT NULL,
      mass_kg             double precision NOT NULL,
      volume_m3           double precision NOT NULL,
      standard_volume_m3  double precision NOT NULL,
      energy_j            double precision,
      coverage            double precision NOT NULL,
      flags               text[] NOT NULL DEFAULT '{}',
      uncertainty_percent double precision,
      status              text NOT NULL,
      computed_at         timestamptz NOT NULL DEFAULT now(),
      PRIMARY KEY (meter_run_id, month)
    );

    -- Hours whose record must be (re)computed: new, late or corrected readings, or a
    -- configuration version dated in the past, put them here; the history worker drains it.
    -- claimed_at is set while a worker computes the hour; a reading queued after the claim
    -- (queued_at > claimed_at) keeps the row for another round.
    -- first_queued_at and queued_at debounce the work: an hour is taken once it has been quiet
    -- for a second, or has waited ten seconds (a live hour), not at every reading.
    CREATE TABLE stale_hours (
      meter_run_id    bigint NOT NULL,
      start           timestamptz NOT NULL,
      queued_at       timestamptz NOT NULL DEFAULT clock_timestamp(),
      first_queued_at timestamptz NOT NULL DEFAULT clock_timestamp(),
      claimed_at      timestamptz,
      PRIMARY KEY (meter_run_id, start)
    );
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    DROP TABLE stale_hours, monthly_totals, daily_totals, hourly_records, field_totals, imports,
      readings, devices, transmitters, config_versions, meter_runs, sites;
    DROP TYPE stack_role; DROP TYPE transmitter_measure;
  `);
};
