import path from 'node:path';
import { Pool } from 'pg';
import { Catalog } from './ingest/catalog';
import { ReadingWriter, GroupCommitter } from './ingest/reading-writer';
import { DeviceCounters } from './ingest/device-counters';
import { DeviceAuthenticator } from './ingest/device-auth';
import { createMqttIngest } from './ingest/mqtt-ingest';
import { importFieldTotalsCsv, importReadingsCsv } from './ingest/csv-import';
import { HistoryWorker } from './history/worker';
import { LiveEvents } from './live';
import { AlarmEvaluator } from './alarms/alarm-evaluator';
import { cachedHourStartOf } from './ingest/hour-start-cache';
import type { Sequelize } from 'sequelize';
import { logConnectionError } from './db/availability';

/**
 * The long-lived parts of the server that routes, the broker and jobs share: one pg pool for
 * bulk work beside Sequelize's, the transmitter catalog, the reading writer with group commit,
 * the history worker and the live event fan-out.
 */
export function createServices(options: { databaseUrl: string; sequelize: Sequelize; dataDir: string }) {
  // A connection that fails to open within 5 s is an error (a 503 for a request), not a hang; an idle
  // connection the database ends (a restart) is logged and replaced, never an unheard 'error' event.
  const pool = new Pool({
    connectionString: options.databaseUrl,
    max: 10,
    connectionTimeoutMillis: 5000,
    keepAlive: true,
  });
  pool.on('error', logConnectionError('services pool'));
  const catalog = new Catalog(options.sequelize);
  const writer = new ReadingWriter(pool, cachedHourStartOf());
  const committer = new GroupCommitter(writer);
  const counters = new DeviceCounters(pool);
  const deviceAuth = new DeviceAuthenticator();
  const live = new LiveEvents();
  const history = new HistoryWorker(pool);
  // Alarms: judged after each history round and on the minute (index.ts wires both).
  const alarms = new AlarmEvaluator(pool);
  const stored = (readings: { meterRunId: string }[]) => live.readingsStored(readings.map((r) => r.meterRunId));
  const mqttIngest = createMqttIngest({ catalog, committer, counters, onStored: stored });
  const imports = {
    readings: (id: string, file: string) => importReadingsCsv({ pool, catalog, writer, onStored: stored }, id, file),
    fieldTotals: (id: string, file: string) => importFieldTotalsCsv({ pool }, id, file),
  };
  /**
   * Set by startServer once the embedded broker runs: drops the connections of a device. `address`
   * is where devices publish (the external broker's URL, or the embedded broker's port), null until known.
   */
  const brokerControl: {
    disconnect: (username: string) => void;
    address: { externalUrl: string } | { port: number } | null;
  } = { disconnect: (_username: string) => {}, address: null };
  return {
    brokerControl,
    pool,
    catalog,
    writer,
    committer,
    counters,
    deviceAuth,
    live,
    history,
    alarms,
    mqttIngest,
    imports,
    uploadDir: path.join(options.dataDir, 'uploads'),
    /** Imported files kept as part of the record, beside the uploads (resources/imports/originals.ts). */
    originalsDir: path.join(options.dataDir, 'originals'),
    async close() {
      await history.stop();
      await counters.close();
      await pool.end();
    },
  };
}

export type Services = ReturnType<typeof createServices>;
