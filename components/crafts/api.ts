import { apiRequest } from '@/components/api/client';
import { craftListSchema, craftSchema, type Craft, type CreateCraftBody, type UpdateCraftBody } from '@/shared/schemas/crafts';
import { templateListSchema, type TemplateSummary } from '@/shared/schemas/templates';

/** GET /api/crafts: the crafts the caller is a member of (all of the organisation's for org admins). */
export async function listCrafts(): Promise<Craft[]> {
  const { crafts } = await apiRequest('GET', '/api/crafts', { schema: craftListSchema });
  return crafts;
}

/** GET /api/crafts/:craftId */
export function getCraft(craftId: string): Promise<Craft> {
  return apiRequest('GET', `/api/crafts/${encodeURIComponent(craftId)}`, { schema: craftSchema });
}

/** POST /api/crafts (org admins): from a template (`templateId`) or a copy of a craft's sheet (`copyOf`); the creator becomes its chief engineer. */
export function createCraft(body: CreateCraftBody): Promise<Craft> {
  return apiRequest('POST', '/api/crafts', { body, schema: craftSchema });
}

/** PATCH /api/crafts/:craftId (chief engineers and org admins). */
export function updateCraft(craftId: string, body: UpdateCraftBody): Promise<Craft> {
  return apiRequest('PATCH', `/api/crafts/${encodeURIComponent(craftId)}`, { body, schema: craftSchema });
}

/** GET /api/templates: the templates a new craft can start from. */
export async function listTemplates(): Promise<TemplateSummary[]> {
  const { templates } = await apiRequest('GET', '/api/templates', { schema: templateListSchema });
  return templates;
}
