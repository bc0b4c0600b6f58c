import { apiRequest } from '@/components/api/client';
import { allowanceTableResponseSchema, type AllowanceTable, type AllowanceTableResponse } from '@/shared/schemas/allowance-tables';

function tablePath(craftId: string): string {
  return `/api/crafts/${encodeURIComponent(craftId)}/allowance-table`;
}

/** GET /api/crafts/:craftId/allowance-table: the craft's own allowance table, null while it has none. */
export function getAllowanceTable(craftId: string): Promise<AllowanceTableResponse> {
  return apiRequest('GET', tablePath(craftId), { schema: allowanceTableResponseSchema });
}

/** PUT /api/crafts/:craftId/allowance-table: saves the craft's own table; the budget reads it from then on. */
export function saveAllowanceTable(craftId: string, table: AllowanceTable): Promise<AllowanceTableResponse> {
  return apiRequest('PUT', tablePath(craftId), { body: { table }, schema: allowanceTableResponseSchema });
}
