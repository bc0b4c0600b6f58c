import { z } from 'zod';

/** A template a craft can start from, as GET /api/templates lists it. */
export const templateSummarySchema = z.object({
  id: z.string(),
  name: z.string(),
  description: z.string(),
  parameterCount: z.number().int(),
});
export type TemplateSummary = z.infer<typeof templateSummarySchema>;

export const templateListSchema = z.object({ templates: z.array(templateSummarySchema) });
