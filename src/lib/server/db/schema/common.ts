import { integer } from 'drizzle-orm/sqlite-core';

/** Milliseconds since the epoch, read back as a Date. */
export const timestamp = () => integer({ mode: 'timestamp_ms' });

export const ROLES = ['lead', 'advisor', 'member', 'alumni'] as const;
export type Role = (typeof ROLES)[number];

export const PHASES = ['design', 'build', 'test', 'race', 'handover'] as const;
export type Phase = (typeof PHASES)[number];

export const RECORD_KINDS = ['decision', 'lesson'] as const;
export type RecordKind = (typeof RECORD_KINDS)[number];

export const DECISION_STATUSES = ['draft', 'proposed', 'accepted', 'superseded', 'withdrawn'] as const;
export const LESSON_STATUSES = ['open', 'addressed'] as const;
export type RecordStatus = (typeof DECISION_STATUSES)[number] | (typeof LESSON_STATUSES)[number];

export const LESSON_SOURCES = ['testing', 'building', 'racing', 'organising'] as const;

export const ONBOARDING_KINDS = ['guide', 'record', 'calculation'] as const;
