import { QueryTypes, type Sequelize } from 'sequelize';

/** What ingest needs to know about a transmitter, looked up by site code and tag. */
export interface CatalogTransmitter {
  id: string;
  tag: string;
  meterRunId: string;
  siteId: string;
  siteCode: string;
  timeZone: string;
  measures: 'differential-pressure' | 'static-pressure' | 'temperature' | 'flow-direction';
  unit: string;
  pressureReference: 'absolute' | 'gauge';
  lowerRange: number;
  upperRange: number;
  atmosphericPressurePa: number;
  /**
   * When the meter run's history starts (its first configuration version takes effect), epoch ms:
   * a reading before it belongs to no record and is refused. Absent: no such limit is known.
   */
  historyStartMs?: number;
  /**
   * How long one reading may stand for, s: the longest hold limit or gap limit any of the meter
   * run's dated settings gives (the history worker looks back as far). A reading also feeds the
   * first seconds of the hours after its own up to this long, so those hours are queued with it.
   */
  reachS?: number;
}

/**
 * An in-memory copy of the transmitter list, so that each reading costs a map lookup rather
 * than a query. Set-up changes call `invalidate()`; a reload happens at most once at a time.
 */
export class Catalog {
  private byTopic = new Map<string, CatalogTransmitter>();
  private byTag = new Map<string, CatalogTransmitter>();
  private loading: Promise<void> | null = null;
  private stale = true;

  constructor(private readonly sequelize: Sequelize) {}

  invalidate() {
    this.stale = true;
  }

  private async load() {
    const rows = await this.sequelize.query<CatalogTransmitter>(
      `
      SELECT t.id::text, t.tag, t.meter_run_id::text AS "meterRunId", s.id::text AS "siteId", s.code AS "siteCode",
             s.time_zone AS "timeZone", t.measures, t.unit, t.pressure_reference AS "pressureReference",
             t.lower_range AS "lowerRange", t.upper_range AS "upperRange", s.atmospheric_pressure_pa AS "atmosphericPressurePa",
             (SELECT (extract(epoch FROM min(c.effective_from)) * 1000)::float8 FROM config_versions c
               WHERE c.meter_run_id = m.id) AS "historyStartMs",
             (SELECT max(greatest(v.hold_limit_s, v.max_gap_s)) FROM meter_run_setting_versions v
               WHERE v.meter_run_id = m.id) AS "reachS"
        FROM transmitters t JOIN meter_runs m ON m.id = t.meter_run_id JOIN sites s ON s.id = m.site_id`,
      { type: QueryTypes.SELECT },
    );
    const byTopic = new Map<string, CatalogTransmitter>();
    const byTag = new Map<string, CatalogTransmitter>();
    for (const row of rows) {
      // No version yet (none is ever missing once a meter run exists, but a NULL must not become 0 or NaN).
      if (row.historyStartMs === null) delete row.historyStartMs;
      if (row.reachS === null) delete row.reachS;
      byTopic.set(`${row.siteCode}/${row.tag}`, row);
      byTag.set(row.tag, row);
    }
    this.byTopic = byTopic;
    this.byTag = byTag;
  }

  private loadedAt = 0;

  async ready() {
    // Callers that arrive during a load wait for it rather than read the old maps.
    while (this.stale || this.loading) {
      if (!this.loading) {
        this.stale = false;
        this.loading = this.load()
          .then(() => void (this.loadedAt = Date.now()))
          .finally(() => (this.loading = null));
      }
      await this.loading;
    }
  }

  /**
   * A miss may be a transmitter another process has just created: reload, at most every few
   * seconds, before calling it unknown.
   */
  private async lookup(map: () => Map<string, CatalogTransmitter>, key: string) {
    await this.ready();
    const hit = map().get(key);
    if (hit || Date.now() - this.loadedAt < 5000) return hit ?? null;
    this.stale = true;
    await this.ready();
    return map().get(key) ?? null;
  }

  bySiteAndTag(siteCode: string, tag: string) {
    return this.lookup(() => this.byTopic, `${siteCode}/${tag}`);
  }

  byTransmitterTag(tag: string) {
    return this.lookup(() => this.byTag, tag);
  }
}
