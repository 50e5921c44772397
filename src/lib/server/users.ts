import type { Role } from '../domain';

export interface PublicUser {
  id: string;
  email: string;
  name: string;
  role: Role;
}

export function toPublicUser(u: { id: string; email: string; name: string; role: Role }): PublicUser {
  return { id: u.id, email: u.email, name: u.name, role: u.role };
}
