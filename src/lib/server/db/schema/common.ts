import { integer } from 'drizzle-orm/sqlite-core';

/** Milliseconds since the epoch, read back as a Date. */
export const timestamp = () => integer({ mode: 'timestamp_ms' });
