/**
 * Device credentials for MQTT (admin): GET, POST /api/devices; PATCH /api/devices/:id;
 * GET /api/devices/:id/rejections (why its readings were refused).
 * The password comes back once, in the answer to POST; the server keeps only its hash.
 */
import { useMutation, useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';
import { z } from 'zod';

import { apiRequest } from './client';

const id = z.union([z.string(), z.number()]).transform(String);

export const deviceSchema = z.object({
  id,
  siteId: id,
  siteCode: z.string().optional(),
  name: z.string(),
  username: z.string(),
  disabled: z.boolean(),
  acceptedCount: z.number(),
  rejectedCount: z.number(),
  lastRejection: z.string().nullable(),
  lastSeenAt: z.string().nullable(),
  createdAt: z.string(),
  /** Where the device publishes (absent from a PATCH answer; null when the server does not know yet). */
  broker: z.object({ url: z.string() }).nullable().optional(),
});
export type Device = z.infer<typeof deviceSchema>;

const createdDeviceSchema = deviceSchema.extend({ password: z.string().min(1) });
export type CreatedDevice = z.infer<typeof createdDeviceSchema>;

export const deviceRejectionsSchema = z.object({
  deviceId: id,
  logSize: z.number(),
  countsByReason: z.array(z.object({ kind: z.string(), count: z.number(), since: z.string() })),
  latest: z.array(
    z.object({
      at: z.string(),
      topic: z.string(),
      kind: z.string(),
      reason: z.string(),
      readingIndex: z.number().nullable(),
    }),
  ),
});
export type DeviceRejections = z.infer<typeof deviceRejectionsSchema>;

export const deviceKeys = {
  all: ['devices'] as const,
  list: () => [...deviceKeys.all, 'list'] as const,
  rejections: (deviceId: string) => [...deviceKeys.all, 'rejections', deviceId] as const,
};

/** @returns every device, oldest first */
export function useDevices() {
  return useQuery({
    queryKey: deviceKeys.list(),
    queryFn: ({ signal }) => apiRequest({ path: '/devices', schema: z.array(deviceSchema), signal }),
  });
}

/** @returns a device's refusal log (counts by reason, latest first), fetched only while `enabled` */
export function useDeviceRejections(deviceId: string, enabled: boolean) {
  return useQuery({
    queryKey: deviceKeys.rejections(deviceId),
    enabled,
    queryFn: ({ signal }) =>
      apiRequest({
        path: `/devices/${encodeURIComponent(deviceId)}/rejections`,
        schema: deviceRejectionsSchema,
        signal,
      }),
  });
}

/**
 * Replaces one device in the cached list. PATCH answers without the site code, so the cached
 * one is kept.
 */
export function setDeviceInList(queryClient: QueryClient, device: Device): void {
  queryClient.setQueryData<Device[]>(deviceKeys.list(), (list) => {
    if (!list) return list;
    const index = list.findIndex((existing) => existing.id === device.id);
    if (index === -1) return [...list, device];
    return list.map((existing) =>
      existing.id === device.id ? { ...device, siteCode: device.siteCode ?? existing.siteCode } : existing,
    );
  });
}

export interface NewDevice {
  name: string;
  siteId: string;
}

/** @returns a mutation that issues credentials for a new device; its result holds the password, once */
export function useCreateDevice() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (device: NewDevice) =>
      apiRequest({ method: 'POST', path: '/devices', body: device, schema: createdDeviceSchema }),
    onSuccess: ({ password: _password, ...device }) => {
      // The password never goes into the cache: it is shown by the form that asked, then gone.
      setDeviceInList(queryClient, device);
      void queryClient.invalidateQueries({ queryKey: deviceKeys.all });
    },
  });
}

/** @returns a mutation that disables or enables a device's sign-in */
export function useSetDeviceDisabled() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id: deviceId, disabled }: { id: string; disabled: boolean }) =>
      apiRequest({
        method: 'PATCH',
        path: `/devices/${encodeURIComponent(deviceId)}`,
        body: { disabled },
        schema: deviceSchema,
      }),
    onSuccess: (device) => {
      setDeviceInList(queryClient, device);
      void queryClient.invalidateQueries({ queryKey: deviceKeys.all });
    },
  });
}
