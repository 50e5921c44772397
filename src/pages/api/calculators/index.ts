import type { APIRoute } from 'astro';
import { handle, json, requirePermission } from '~/lib/server/http';
import { calculators } from '~/lib/calc';

export const GET: APIRoute = handle(({ locals }) => {
  requirePermission(locals, 'read');
  return json({
    calculators: Object.values(calculators).map((c) => ({
      kind: c.kind,
      title: c.title,
      summary: c.summary,
      engineVersion: c.engineVersion,
      inputs: c.inputs,
      outputs: c.outputs,
      sources: c.sources,
      cautions: c.cautions,
    })),
  });
});
