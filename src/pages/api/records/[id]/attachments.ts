import type { APIRoute } from 'astro';
import { handle, json, requirePermission } from '~/lib/server/http';
import { uploadAttachment } from '~/lib/server/records/attachments';

export const POST: APIRoute = handle(async ({ locals, params, request }) => {
  const user = requirePermission(locals, 'record:create');
  return json({ attachment: await uploadAttachment(params.id ?? '', request, user) }, 201);
});
