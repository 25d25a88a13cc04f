import { z } from 'zod';

/** `GET /api/sites/:id/care-due[?sort=due|-due]` */
export const careDueQuery = z.object({
  sort: z.enum(['due', '-due'], { error: 'must be due (earliest first) or -due (latest first)' }).default('due'),
});
