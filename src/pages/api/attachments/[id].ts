import type { APIRoute } from 'astro';
import { handle, requirePermission } from '~/lib/server/http';
import { attachmentResponse } from '~/lib/server/records/attachments';

export const GET: APIRoute = handle(({ locals, params }) => {
  requirePermission(locals, 'read');
  return attachmentResponse(params.id ?? '');
});
