import { hash, verify } from '@node-rs/argon2';

// OWASP's argon2id minimum (19 MiB, 2 iterations, 1 lane): https://cheatsheetseries.owasp.org/cheatsheets/Password_Storage_Cheat_Sheet.html
const OPTIONS = { memoryCost: 19456, timeCost: 2, outputLen: 32, parallelism: 1 } as const;

export function hashPassword(password: string): Promise<string> {
  return hash(password, OPTIONS);
}

export async function verifyPassword(passwordHash: string, password: string): Promise<boolean> {
  try {
    return await verify(passwordHash, password);
  } catch {
    return false; // a malformed stored hash never signs anyone in
  }
}

/** A hash of nothing in particular, verified when the account does not exist so timing does not reveal it. */
let decoy: Promise<string> | undefined;
export async function verifyDecoy(password: string): Promise<false> {
  decoy ??= hashPassword('wakebook-decoy-password');
  await verifyPassword(await decoy, password);
  return false;
}
