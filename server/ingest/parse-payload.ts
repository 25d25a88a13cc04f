/** One raw reading as a device sends it: `{ "t": ISO 8601 | epoch ms, "v": number, "q": "good", "u"?: unit }`. */
export interface RawReading {
  time: unknown;
  value: unknown;
  quality?: unknown;
  unit?: unknown;
  /** Why this item cannot be a reading at all (not an object): refused alone, its neighbours kept. */
  problem?: string;
}

/**
 * Parses an MQTT payload: one reading object or a JSON array of them. Returns the raw readings
 * or a reason the whole payload is refused.
 */
export function parsePayload(payload: Buffer | string): RawReading[] | string {
  let parsed: unknown;
  try {
    parsed = JSON.parse(typeof payload === 'string' ? payload : payload.toString('utf8'));
  } catch {
    return 'payload: not valid JSON';
  }
  const items = Array.isArray(parsed) ? parsed : [parsed];
  if (items.length === 0) return 'payload: an empty array holds no reading';
  if (items.length > 10_000) return 'payload: more than 10000 readings in one message';
  const out: RawReading[] = [];
  for (const item of items) {
    // A stray number or string beside good readings costs only itself (bad data never takes good data with it).
    if (!item || typeof item !== 'object' || Array.isArray(item)) {
      out.push({ time: undefined, value: undefined, problem: 'reading: must be an object { "t", "v", "q" }' });
      continue;
    }
    const o = item as Record<string, unknown>;
    out.push({ time: o.t, value: o.v, quality: o.q, unit: o.u });
  }
  return out;
}

/** `tallyrun/<site code>/<transmitter tag>` → its parts, or null. */
export function parseTopic(topic: string): { siteCode: string; tag: string } | null {
  const parts = topic.split('/');
  if (parts.length !== 3 || parts[0] !== 'tallyrun' || !parts[1] || !parts[2]) return null;
  return { siteCode: parts[1], tag: parts[2] };
}
