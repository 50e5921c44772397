import { eq } from 'drizzle-orm';
import { db } from './db/client';
import type { Role } from '../domain';
import { users } from './db/schema';

export interface PublicUser {
  id: string;
  email: string;
  name: string;
  role: Role;
}

export function toPublicUser(u: { id: string; email: string; name: string; role: Role }): PublicUser {
  return { id: u.id, email: u.email, name: u.name, role: u.role };
}

export function findUserById(id: string) {
  return db().select().from(users).where(eq(users.id, id)).get();
}
