import type { z } from 'zod';
import { siteSchema } from '../../../shared/schemas/setup';

/** `POST /api/sites` (the form's own schema). */
export const createSiteBody = siteSchema;
export type SiteInput = z.infer<typeof createSiteBody>;

/** `PATCH /api/sites/:id`: any of the fields, each checked as on creation. */
export const updateSiteBody = siteSchema.partial().strict();
export type SiteChanges = z.infer<typeof updateSiteBody>;
