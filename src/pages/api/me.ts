import type { APIRoute } from 'astro';
import { handle, json, requireUser } from '~/lib/server/http';
import { toPublicUser } from '~/lib/server/users';

export const GET: APIRoute = handle(({ locals }) => json({ user: toPublicUser(requireUser(locals)) }));
