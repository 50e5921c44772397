import type { APIRoute } from 'astro';
import { handle, requirePermission } from '~/lib/server/http';
import { databaseBackup } from '~/lib/server/backup';
import { recordAudit } from '~/lib/server/audit';
import { clientAddress } from '~/lib/server/client-address';

/** A consistent SQLite copy for leads; restoring it is described in the README. */
export const GET: APIRoute = handle(async (context) => {
  const actor = requirePermission(context.locals, 'export:run');
  const backup = await databaseBackup();
  recordAudit({
    actor,
    action: 'backup.run',
    targetType: 'database',
    targetId: backup.fileName,
    detail: { bytes: backup.size },
    ip: clientAddress(context),
  });
  return new Response(backup.stream, {
    status: 200,
    headers: {
      'content-type': 'application/vnd.sqlite3',
      'content-length': String(backup.size),
      'content-disposition': `attachment; filename="${backup.fileName}"`,
      'cache-control': 'no-store',
      'x-content-type-options': 'nosniff',
    },
  });
});
