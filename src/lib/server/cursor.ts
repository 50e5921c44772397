// Keyset paging for lists ordered newest first: a cursor is "<timestamp ms>.<id>" of the last row of the previous
// page, so a page never repeats or skips rows when new ones arrive. Used by the records and calculations lists.
import { invalidInput } from './http';

const CURSOR = /^(\d{1,15})\.([A-Za-z0-9_-]{1,64})$/;

export interface Cursor {
  at: number;
  id: string;
}

export function encodeCursor(at: string | Date, id: string): string {
  return `${typeof at === 'string' ? Date.parse(at) : at.getTime()}.${id}`;
}

/** The position a cursor names; a malformed cursor is a 400 on the `cursor` field. */
export function decodeCursor(cursor: string | undefined): Cursor | null {
  if (!cursor) return null;
  const m = CURSOR.exec(cursor);
  if (!m) throw invalidInput([{ path: 'cursor', message: 'Not a valid cursor.' }]);
  return { at: Number(m[1]), id: m[2] };
}

/** A cursor from a page's query string, or undefined when there is none or it is malformed (first page). */
export function pageCursor(param: string | null): string | undefined {
  return param && CURSOR.test(param) ? param : undefined;
}
