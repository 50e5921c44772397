import type { APIRoute } from 'astro';
import { handle, json, requirePermission } from '~/lib/server/http';
import { listPeople } from '~/lib/server/people';
import { can } from '~/lib/policy';

export const GET: APIRoute = handle(({ locals }) => {
  const user = requirePermission(locals, 'read');
  const people = listPeople().map((p) => ({
    ...p,
    // Addresses and last sign-in are for leads; everyone else sees names, roles and who owns what.
    email: can(user, 'people:manage') ? p.email : undefined,
    lastSignInAt: can(user, 'people:manage') ? p.lastSignInAt : undefined,
  }));
  return json({ people });
});
