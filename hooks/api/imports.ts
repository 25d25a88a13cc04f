/**
 * CSV imports of readings and field totals (engineer, admin): POST /api/imports (multipart),
 * GET /api/imports/:id (progress and every rejected line), GET /api/imports (the latest 100),
 * GET /api/imports/:id/original (the file as uploaded, kept with its SHA-256).
 *
 * The upload is multipart, which the JSON client (client.ts) does not send, so it is posted
 * here with the session's token; errors come back as the same ApiError.
 */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';

import { config } from '@/constants/config';
import { useSession } from '@/hooks/session/SessionProvider';
import { ApiError, apiRequest } from './client';

export const importKinds = ['readings', 'field-totals'] as const;
export type ImportKind = (typeof importKinds)[number];

export const importSchema = z.object({
  id: z.union([z.string(), z.number()]).transform(String),
  kind: z.enum(importKinds).catch('readings'),
  filename: z
    .string()
    .nullable()
    .transform((name) => name ?? ''),
  status: z.enum(['running', 'done', 'failed']),
  bytesTotal: z.number(),
  bytesRead: z.number(),
  rowsRead: z.number(),
  rowsImported: z.number(),
  duplicates: z.number(),
  rejected: z.number(),
  errors: z
    .array(z.object({ line: z.number(), message: z.string() }))
    .nullable()
    .transform((errors) => errors ?? []),
  createdAt: z.string(),
  finishedAt: z.string().nullable(),
  /** SHA-256 (hex) of the kept original; null for imports made before originals were kept. */
  sha256: z.string().nullable().catch(null),
  uploadedBy: z.string().nullable().catch(null),
  uploadedAt: z.string().nullable().catch(null),
  /** The meter runs a finished import touched (the detail only; absent from the list). */
  meterRuns: z.array(z.object({ id: z.union([z.string(), z.number()]).transform(String), tag: z.string() })).optional(),
});
export type Import = z.infer<typeof importSchema>;

const startedSchema = z.object({ id: z.union([z.string(), z.number()]).transform(String), status: z.string() });

export const importKeys = {
  all: ['imports'] as const,
  list: () => [...importKeys.all, 'list'] as const,
  detail: (importId: string) => [...importKeys.all, 'detail', importId] as const,
};

/** While an import runs, its progress is re-read this often (the server saves it after each batch). */
export const importPollMs = 500;

/** @returns the latest 100 imports, newest first */
export function useImports() {
  return useQuery({
    queryKey: importKeys.list(),
    queryFn: ({ signal }) => apiRequest({ path: '/imports', schema: z.array(importSchema), signal }),
  });
}

/**
 * One import, re-read every half second while it runs; once it has finished the list of recent
 * imports is refreshed too.
 * @param importId the import to follow, or null for none
 */
export function useImport(importId: string | null) {
  const queryClient = useQueryClient();
  return useQuery({
    queryKey: importKeys.detail(importId ?? ''),
    enabled: importId !== null,
    queryFn: async ({ signal }) => {
      const found = await apiRequest({
        path: `/imports/${encodeURIComponent(importId ?? '')}`,
        schema: importSchema,
        signal,
      });
      if (found.status !== 'running') void queryClient.invalidateQueries({ queryKey: importKeys.list() });
      return found;
    },
    refetchInterval: (query) => (query.state.data?.status === 'running' ? importPollMs : false),
  });
}

/** A file chosen for upload: its name and its bytes. */
export interface ImportFile {
  name: string;
  blob: Blob;
}

/** The server's error body of a refused upload or download, as an ApiError. */
async function errorFromUpload(response: Response): Promise<ApiError> {
  const body = (await response.json().catch(() => null)) as {
    error?: { code?: string; message?: string; field?: string };
  } | null;
  const error = body?.error;
  return new ApiError(
    response.status,
    error?.code ?? `http_${response.status}`,
    error?.message ?? `The server refused the upload (${response.status}).`,
    error?.field,
  );
}

/** @returns a mutation that uploads a CSV and answers with the new import's id */
export function useStartImport() {
  const queryClient = useQueryClient();
  const { state, signOut } = useSession();
  const token = state.status === 'signed-in' ? state.token : null;
  return useMutation({
    mutationFn: async ({ file, kind }: { file: ImportFile; kind: ImportKind }) => {
      const form = new FormData();
      form.append('kind', kind);
      form.append('file', file.blob, file.name);
      let response: Response;
      try {
        response = await fetch(`${config.apiBaseUrl}/imports`, {
          method: 'POST',
          headers: token
            ? { Authorization: `Bearer ${token}`, Accept: 'application/json' }
            : { Accept: 'application/json' },
          body: form,
        });
      } catch {
        throw new ApiError(0, 'network_error', 'Cannot reach the Tallyrun server. Check the connection and try again.');
      }
      if (!response.ok) {
        if (response.status === 401 && token) signOut('expired');
        throw await errorFromUpload(response);
      }
      const parsed = startedSchema.safeParse(await response.json().catch(() => null));
      if (!parsed.success)
        throw new ApiError(response.status, 'unexpected_response', 'The server did not say which import it started.');
      return parsed.data;
    },
    onSuccess: () => {
      void queryClient.invalidateQueries({ queryKey: importKeys.list() });
    },
  });
}

/**
 * @returns a mutation that downloads an import's kept original under the name it was uploaded
 * with (web: the browser's download; the file is fetched with the session's token, which a plain
 * link could not send)
 */
export function useDownloadOriginal() {
  const { state, signOut } = useSession();
  const token = state.status === 'signed-in' ? state.token : null;
  return useMutation({
    mutationFn: async (item: { id: string; filename: string }) => {
      if (typeof document === 'undefined')
        throw new ApiError(0, 'unsupported', 'Download the original from Tallyrun in a web browser.');
      let response: Response;
      try {
        response = await fetch(`${config.apiBaseUrl}/imports/${encodeURIComponent(item.id)}/original`, {
          headers: token ? { Authorization: `Bearer ${token}` } : {},
        });
      } catch {
        throw new ApiError(0, 'network_error', 'Cannot reach the Tallyrun server. Check the connection and try again.');
      }
      if (!response.ok) {
        if (response.status === 401 && token) signOut('expired');
        throw await errorFromUpload(response);
      }
      const url = URL.createObjectURL(await response.blob());
      const link = document.createElement('a');
      link.href = url;
      link.download = item.filename || `import-${item.id}.csv`;
      document.body.appendChild(link);
      link.click();
      link.remove();
      // The browser has taken the file once the click is handled; free the blob after that.
      setTimeout(() => URL.revokeObjectURL(url), 10_000);
    },
  });
}
