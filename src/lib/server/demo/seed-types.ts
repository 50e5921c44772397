import type { db } from '../db/client';

export type Tx = Parameters<Parameters<ReturnType<typeof db>['transaction']>[0]>[0];

export interface SeedIds {
  seasonIdByName: Map<string, string>;
  userIdByEmail: Map<string, string>;
}
