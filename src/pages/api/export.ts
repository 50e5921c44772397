import type { APIRoute } from 'astro';
import { handle, requirePermission } from '~/lib/server/http';
import { handoverBundle } from '~/lib/server/export/bundle';
import { recordAudit } from '~/lib/server/audit';
import { clientAddress } from '~/lib/server/client-address';

/** The handover bundle, streamed as it is written (its length is not known in advance). */
export const GET: APIRoute = handle(async (context) => {
  const actor = requirePermission(context.locals, 'export:run');
  const bundle = await handoverBundle();
  recordAudit({
    actor,
    action: 'export.run',
    targetType: 'bundle',
    targetId: bundle.fileName,
    detail: { ...bundle.counts },
    ip: clientAddress(context),
  });
  return new Response(bundle.stream, {
    status: 200,
    headers: {
      'content-type': 'application/zip',
      'content-disposition': `attachment; filename="${bundle.fileName}"`,
      'cache-control': 'no-store',
      'x-content-type-options': 'nosniff',
    },
  });
});
