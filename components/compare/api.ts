import { apiRequest } from '@/components/api/client';
import { compareResponseSchema, type CompareQuery, type CompareResponse } from '@/shared/schemas/compare';

/**
 * GET /api/crafts/:craftId/compare?from=&to=[&output=]: the rows and outputs of two revisions compared on the
 * server, and with `output` what moved that output; 400 for a malformed id or an output with nothing to
 * compare, 404 for a revision (or output) the caller cannot see in this craft.
 */
export function getComparison(craftId: string, { from, to, output }: CompareQuery): Promise<CompareResponse> {
  const query = new URLSearchParams({ from, to, ...(output === undefined ? {} : { output }) });
  return apiRequest('GET', `/api/crafts/${encodeURIComponent(craftId)}/compare?${query.toString()}`, { schema: compareResponseSchema });
}
