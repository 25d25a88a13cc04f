import { z } from 'zod';
import { deviceSchema } from '../../../shared/schemas/setup';

/** `POST /api/devices`: the client's form checks the same schema. */
export const createDeviceBody = deviceSchema;

/** `PATCH /api/devices/:id`: a device is only enabled or disabled; its credentials never change. */
export const updateDeviceBody = z.object({ disabled: z.boolean({ error: 'must be true or false' }) }).strict();
