import fs from 'node:fs';
import path from 'node:path';

/**
 * PostgreSQL resolves a bare name in ORDER BY to an output column first (SQL-92 rule, PostgreSQL
 * manual, "SELECT: ORDER BY Clause"). So `SELECT id::text … ORDER BY id` sorts the ids as text —
 * 10 before 9 — which once put alarm events and audit events out of order only after the ids
 * grew past a power of ten. This test reads every SQL text in the server and refuses an ORDER
 * BY on a bare name that the same query also selects as `name::text`; qualify it (`alarm_events.id`).
 */
function sourceFiles(dir: string): string[] {
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) return sourceFiles(full);
    return entry.name.endsWith('.ts') && !entry.name.endsWith('.test.ts') ? [full] : [];
  });
}

/** Names a query selects cast to text without renaming them: `id::text`, `m.id::text` (output column "id"). */
function textCastNames(sql: string): Set<string> {
  const names = new Set<string>();
  for (const m of sql.matchAll(/(?:\w+\.)?(\w+)::text(?!\s+AS\b)/gi)) names.add(m[1].toLowerCase());
  return names;
}

/** Bare (unqualified) names in the query's ORDER BY lists. */
function bareOrderNames(sql: string): string[] {
  const names: string[] = [];
  for (const m of sql.matchAll(/ORDER BY\s+([^)`'";]*?)(?:\bLIMIT\b|\)|$|`|'|;)/gi)) {
    for (const item of m[1].split(',')) {
      const bare = /^\s*(\w+)\s*(?:ASC|DESC)?(?:\s+NULLS\s+(?:FIRST|LAST))?\s*$/i.exec(item);
      if (bare) names.push(bare[1].toLowerCase());
    }
  }
  return names;
}

describe('SQL in the server', () => {
  it('never orders by a bare name that the same query selects cast to text', () => {
    const offenders: string[] = [];
    for (const file of sourceFiles(path.join(__dirname))) {
      const text = fs.readFileSync(file, 'utf8');
      for (const literal of text.match(/`[^`]*`|'[^'\n]*'/g) ?? []) {
        if (!/ORDER BY/i.test(literal)) continue;
        const casts = textCastNames(literal);
        for (const name of bareOrderNames(literal)) {
          if (casts.has(name)) offenders.push(`${path.relative(__dirname, file)}: ORDER BY ${name}`);
        }
      }
    }
    expect(offenders).toEqual([]);
  });

  it('catches the mistake it is there for', () => {
    const sql = 'SELECT id::text, action FROM alarm_events WHERE alarm_id = $1 ORDER BY id';
    expect(bareOrderNames(sql).filter((n) => textCastNames(sql).has(n))).toEqual(['id']);
    const fixed = 'SELECT id::text, action FROM alarm_events WHERE alarm_id = $1 ORDER BY alarm_events.id';
    expect(bareOrderNames(fixed).filter((n) => textCastNames(fixed).has(n))).toEqual([]);
  });
});
