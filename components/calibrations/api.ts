/**
 * Calibrations of a transmitter (issue 11 §1): GET/POST /api/transmitters/:id/calibrations and
 * GET /api/calibrations/:id/certificate. Recording one with a certificate is multipart, which the
 * JSON client does not send, so it is posted here with the session's token.
 */
import { useMutation, useQueries, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';

import { config } from '@/constants/config';
import { ApiError, apiRequest } from '@/hooks/api/client';
import { downloadAuthenticated } from '@/hooks/api/download';
import { transmitterResponseSchema } from '@/hooks/api/transmitters';
import { useSession } from '@/hooks/session/SessionProvider';

const id = z.union([z.string(), z.number()]).transform(String);

const pointSchema = z.object({
  appliedValue: z.number(),
  indicatedValue: z.number(),
  errorPercentOfSpan: z.number(),
  tolerancePercentOfSpan: z.number(),
  pass: z.boolean(),
});
export type CalibrationPoint = z.infer<typeof pointSchema>;

export const calibrationSchema = z.object({
  id,
  transmitterId: id,
  calibratedOn: z.string(),
  laboratory: z.string(),
  accreditation: z.object({ standard: z.string().nullable(), number: z.string().nullable() }),
  unit: z.string(),
  lowerRange: z.number(),
  upperRange: z.number(),
  asFound: z.array(pointSchema),
  asLeft: z.array(pointSchema),
  asFoundPass: z.boolean(),
  asLeftPass: z.boolean(),
  performedBy: z.string(),
  nextDue: z.string(),
  notes: z.string().nullable(),
  certificate: z
    .object({ url: z.string(), fileName: z.string(), contentType: z.string(), sizeBytes: z.number() })
    .nullable(),
  correctsId: z.string().nullable(),
  current: z.boolean(),
});
export type Calibration = z.infer<typeof calibrationSchema>;

/** What the form sends: the server computes each point's error from the transmitter's range. */
export interface NewCalibration {
  calibratedOn: string;
  laboratory: string;
  accreditation?: { standard?: string; number?: string };
  tolerancePercentOfSpan?: number;
  asFound: { appliedValue: number; indicatedValue: number }[];
  asLeft: { appliedValue: number; indicatedValue: number }[];
  performedBy: string;
  nextDue: string;
  notes?: string;
}

/** A file chosen in the browser: its name and bytes. */
export interface CertificateFile {
  name: string;
  blob: Blob;
}

export const calibrationKeys = {
  all: ['calibrations'] as const,
  list: (transmitterId: string) => [...calibrationKeys.all, 'list', transmitterId] as const,
  transmitter: (transmitterId: string) => ['transmitters', 'one', transmitterId] as const,
};

/** @returns one transmitter, for the heading and range of its calibration history */
export function useTransmitter(transmitterId: string) {
  return useQuery({
    queryKey: calibrationKeys.transmitter(transmitterId),
    queryFn: ({ signal }) =>
      apiRequest({
        path: `/transmitters/${encodeURIComponent(transmitterId)}`,
        schema: transmitterResponseSchema,
        signal,
      }),
  });
}

/** @returns the transmitter's calibrations, newest calibration date first */
export function useCalibrations(transmitterId: string) {
  return useQuery({
    queryKey: calibrationKeys.list(transmitterId),
    queryFn: ({ signal }) =>
      apiRequest({
        path: `/transmitters/${encodeURIComponent(transmitterId)}/calibrations`,
        schema: z.array(calibrationSchema),
        signal,
      }),
  });
}

/** @returns a mutation that records a calibration, with its certificate when one was chosen */
export function useRecordCalibration(transmitterId: string) {
  const queryClient = useQueryClient();
  const { state, signOut } = useSession();
  const token = state.status === 'signed-in' ? state.token : null;
  return useMutation({
    mutationFn: async ({
      calibration,
      certificate,
    }: {
      calibration: NewCalibration;
      certificate: CertificateFile | null;
    }) => {
      const form = new FormData();
      form.append('calibration', JSON.stringify(calibration));
      if (certificate) form.append('certificate', certificate.blob, certificate.name);
      let response: Response;
      try {
        response = await fetch(`${config.apiBaseUrl}/transmitters/${encodeURIComponent(transmitterId)}/calibrations`, {
          method: 'POST',
          headers: token
            ? { Authorization: `Bearer ${token}`, Accept: 'application/json' }
            : { Accept: 'application/json' },
          body: form,
        });
      } catch {
        throw new ApiError(0, 'network_error', 'Cannot reach the Tallyrun server. Check the connection and try again.');
      }
      const body = (await response.json().catch(() => null)) as unknown;
      if (!response.ok) {
        if (response.status === 401 && token) signOut('expired');
        const error = (body as { error?: { code?: string; message?: string; field?: string } } | null)?.error;
        throw new ApiError(
          response.status,
          error?.code ?? `http_${response.status}`,
          error?.message ?? `The server refused the calibration (${response.status}).`,
          error?.field,
        );
      }
      const parsed = calibrationSchema.safeParse(body);
      if (!parsed.success)
        throw new ApiError(response.status, 'unexpected_response', 'The server’s answer was not a calibration.');
      return parsed.data;
    },
    onSuccess: () => {
      void queryClient.invalidateQueries({ queryKey: calibrationKeys.list(transmitterId) });
    },
  });
}

/** @returns a mutation that downloads a calibration's certificate under the name it was uploaded with */
export function useDownloadCertificate() {
  const { state, signOut } = useSession();
  const token = state.status === 'signed-in' ? state.token : null;
  return useMutation({
    mutationFn: (calibration: Calibration) =>
      downloadAuthenticated(
        `/calibrations/${encodeURIComponent(calibration.id)}/certificate`,
        calibration.certificate?.fileName ?? `certificate-${calibration.id}`,
        { token, onUnauthorized: () => signOut('expired') },
      ),
  });
}

const proposalSchema = z.object({
  calibrationId: id,
  meterRunId: id,
  timeZone: z.string(),
  start: z.string(),
  end: z.string(),
  shortened: z.boolean(),
  kind: z.literal('adjust'),
  factor: z.number(),
  basis: z.string(),
  reason: z.string(),
});
export type CalibrationCorrectionProposal = z.infer<typeof proposalSchema>;

/** @returns a mutation that asks for the correction a failed as-found suggests (nothing is created) */
export function useCorrectionProposal() {
  return useMutation({
    mutationFn: (calibrationId: string) =>
      apiRequest({
        path: `/calibrations/${encodeURIComponent(calibrationId)}/correction-proposal`,
        schema: proposalSchema,
      }),
  });
}

/**
 * @returns per transmitter id, its latest calibration in force (newest date first, not corrected),
 * or null when none is recorded; undefined while it loads. Shares the history's cache.
 */
export function useLatestCalibrations(
  transmitterIds: readonly string[],
): Record<string, Calibration | null | undefined> {
  const results = useQueries({
    queries: transmitterIds.map((transmitterId) => ({
      queryKey: calibrationKeys.list(transmitterId),
      queryFn: ({ signal }: { signal: AbortSignal }) =>
        apiRequest({
          path: `/transmitters/${encodeURIComponent(transmitterId)}/calibrations`,
          schema: z.array(calibrationSchema),
          signal,
        }),
    })),
  });
  return Object.fromEntries(
    transmitterIds.map((transmitterId, i) => {
      const data = results[i]?.data;
      return [transmitterId, data ? (data.find((c) => c.current) ?? null) : undefined];
    }),
  );
}
