/**
 * Element care records on the wire (issue 11 §2, §3): a meter run's records of one kind, posted as
 * a multipart form (the record as JSON text in its field, the certificate file in `certificate`),
 * which the JSON client does not send, so it is posted here with the session's token; and their
 * certificates downloaded with the token, as the transmitter calibrations do.
 */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';

import { config } from '@/constants/config';
import { ApiError, apiRequest } from '@/hooks/api/client';
import { downloadAuthenticated } from '@/hooks/api/download';
import { meterRunKeys, useMeterRun } from '@/hooks/api/meterRuns';
import { useSite } from '@/hooks/api/sites';
import { useSession } from '@/hooks/session/SessionProvider';

/** A record's certificate file as the server presents it (a link, never a stored path). */
export const certificateFileSchema = z.object({
  name: z.string(),
  contentType: z.string(),
  sizeBytes: z.number(),
  sha256: z.string(),
  url: z.string(),
});
export type CareCertificateFile = z.infer<typeof certificateFileSchema>;

/** What every record of the three kinds carries. */
export const careRecordSchema = z
  .object({
    id: z.string(),
    configVersionId: z.string().nullable(),
    certificate: z.string().nullable(),
    certificateFile: certificateFileSchema.nullable(),
    nextDue: z.string().nullable(),
  })
  .passthrough();

/** A file chosen to send as the certificate. */
export interface ChosenCertificate {
  name: string;
  blob: Blob;
}

/** The site's IANA zone of a meter run (UTC until it is known), for dates typed and shown on its clock. */
export function useMeterRunZone(meterRunId: string): string {
  const run = useMeterRun(meterRunId);
  const site = useSite(run.data?.siteId);
  return site.data?.timeZone ?? 'UTC';
}

/**
 * @param path the collection under the meter run (`gas-analyses`, `element-calibrations`, `inspections`)
 * @param field the multipart field that carries the record as JSON text
 * @returns the records, newest first, and a mutation recording one (which refreshes the meter run's queries)
 */
export function useCareRecords<S extends z.ZodType>(meterRunId: string, path: string, field: string, schema: S) {
  const queryClient = useQueryClient();
  const { state, signOut } = useSession();
  const token = state.status === 'signed-in' ? state.token : null;
  const key = [...meterRunKeys.all, path, meterRunId] as const;
  const list = useQuery({
    queryKey: key,
    queryFn: ({ signal }) =>
      apiRequest({ path: `/meter-runs/${encodeURIComponent(meterRunId)}/${path}`, schema: z.array(schema), signal }),
  });
  const record = useMutation({
    mutationFn: async ({ body, certificate }: { body: unknown; certificate: ChosenCertificate | null }) => {
      const form = new FormData();
      form.append(field, JSON.stringify(body));
      if (certificate) form.append('certificate', certificate.blob, certificate.name);
      let response: Response;
      try {
        response = await fetch(`${config.apiBaseUrl}/meter-runs/${encodeURIComponent(meterRunId)}/${path}`, {
          method: 'POST',
          headers: token
            ? { Authorization: `Bearer ${token}`, Accept: 'application/json' }
            : { Accept: 'application/json' },
          body: form,
        });
      } catch {
        throw new ApiError(0, 'network_error', 'Cannot reach the Tallyrun server. Check the connection and try again.');
      }
      const answer = (await response.json().catch(() => null)) as unknown;
      if (!response.ok) {
        if (response.status === 401 && token) signOut('expired');
        const error = (answer as { error?: { code?: string; message?: string; field?: string } } | null)?.error;
        throw new ApiError(
          response.status,
          error?.code ?? `http_${response.status}`,
          error?.message ?? `The server refused the record (${response.status}).`,
          error?.field,
        );
      }
      return answer;
    },
    onSuccess: () => queryClient.invalidateQueries({ queryKey: meterRunKeys.all }),
  });
  return { list, record };
}

/** @returns a mutation that downloads a record's certificate under the name it was uploaded with */
export function useDownloadCareCertificate() {
  const { state, signOut } = useSession();
  const token = state.status === 'signed-in' ? state.token : null;
  return useMutation({
    mutationFn: (file: CareCertificateFile) =>
      // The presented link is under /api; the client's base already ends there.
      downloadAuthenticated(file.url.replace(/^\/api(?=\/)/, ''), file.name, {
        token,
        onUnauthorized: () => signOut('expired'),
      }),
  });
}
