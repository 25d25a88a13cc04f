/** What an upload may be: `kind` in the multipart form, readings when left out. */
export const importKinds = ['readings', 'field-totals'] as const;
export type ImportKind = (typeof importKinds)[number];

/** The upload's kind, or null when the form names a kind there is none of. */
export function importKindOf(body: { kind?: unknown } | undefined): ImportKind | null {
  const kind = body?.kind ?? 'readings';
  return importKinds.find((k) => k === kind) ?? null;
}
