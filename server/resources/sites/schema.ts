import type { z } from 'zod';
import { siteSchema } from '../../../shared/schemas/setup';
import { datedChangeFields } from '../meter-runs/schema';

/** `POST /api/sites` (the form's own schema). */
export const createSiteBody = siteSchema;
export type SiteInput = z.infer<typeof createSiteBody>;

/**
 * `PATCH /api/sites/:id`: any of the fields, each checked as on creation. The contract hour, base
 * conditions and atmospheric pressure are dated: a change is a version in force from
 * `effectiveFrom` (default now), with a `reason`, and recomputes the site's meter runs from then only.
 */
export const updateSiteBody = siteSchema
  .partial()
  // Without its default: a PATCH that leaves the units out must leave them as they are (zod applies
  // a field's default even inside partial()).
  .extend({ displayUnits: siteSchema.shape.displayUnits.unwrap().optional(), ...datedChangeFields })
  .strict();
export type SiteChanges = z.infer<typeof updateSiteBody>;
