import crypto from 'node:crypto';
import type { Client, Pool } from 'pg';

/** Where the chain of audit events first breaks, and how. */
export interface AuditChainBreak {
  chainSeq: number;
  eventId: string;
  problem: string;
}

export interface AuditChainReport {
  ok: boolean;
  events: number;
  /** The hash of the last event: write it down (or mail it away) to prove later that nothing was cut off the end. */
  headHash: string | null;
  firstBreak: AuditChainBreak | null;
}

interface ChainRow {
  chain_seq: string;
  id: string;
  hash: string;
  previous_hash: string | null;
  canonical: string;
}

const BATCH = 5000;

/**
 * Walks the audit trail in chain order and proves it whole: each event's stored hash equals the
 * SHA-256 of its canonical text (so no column was edited), each event names the hash of the one
 * before it (so none was removed or inserted), and the places run 1, 2, 3 … without a gap.
 *
 * The canonical text comes from PostgreSQL's built-in `jsonb_build_array(...)::text`, the same
 * expression the insert trigger hashes (server/migrations/0004-audit-chain.ts); the hash itself
 * is computed here, in Node, so a replaced trigger or function cannot vouch for itself. What no
 * chain can show alone is the loss of the newest events: compare `headHash` with one kept
 * elsewhere for that.
 */
export async function verifyAuditChain(db: Pool | Client): Promise<AuditChainReport> {
  let events = 0;
  let previousHash: string | null = null;
  let expectedSeq = 1;
  let afterSeq = 0;
  for (;;) {
    const { rows } = await db.query<ChainRow>(
      `SELECT chain_seq::text, id::text, hash, previous_hash,
              jsonb_build_array(
                chain_seq, id, to_char(occurred_at AT TIME ZONE 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.US"Z"'),
                actor_id, actor_email, action, entity_type, entity_id, before, after, reason, previous_hash
              )::text AS canonical
         FROM audit_events WHERE audit_events.chain_seq > $1 ORDER BY audit_events.chain_seq LIMIT ${BATCH}`,
      [afterSeq],
    );
    for (const row of rows) {
      const seq = Number(row.chain_seq);
      const broken = (problem: string): AuditChainReport => ({
        ok: false,
        events,
        headHash: previousHash,
        firstBreak: { chainSeq: seq, eventId: row.id, problem },
      });
      if (seq !== expectedSeq) {
        return broken(
          `event ${row.id} holds place ${seq} of the chain, but place ${expectedSeq} comes first: ` +
            `${seq - expectedSeq} event(s) before it were removed`,
        );
      }
      if (row.previous_hash !== previousHash) {
        return broken(
          `event ${row.id} does not name the hash of the event before it: the chain was cut or re-linked there`,
        );
      }
      const hash = crypto.createHash('sha256').update(row.canonical, 'utf8').digest('hex');
      if (hash !== row.hash) {
        return broken(`event ${row.id} no longer matches its hash: a column of it was changed after it was written`);
      }
      previousHash = row.hash;
      expectedSeq++;
      events++;
    }
    if (rows.length < BATCH) break;
    afterSeq = Number(rows[rows.length - 1].chain_seq);
  }
  return { ok: true, events, headHash: previousHash, firstBreak: null };
}
