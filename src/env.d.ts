/// <reference types="astro/client" />

declare namespace App {
  interface Locals {
    user: import('lucia').User | null;
    session: import('lucia').Session | null;
    /** Set by markCacheable(): the answer depends only on the person, the URL and the stored data. */
    cacheable?: boolean;
    /** The session the server's front door already validated for this request, if it did. */
    sessionCheck?: import('./lib/server/auth/lucia').SessionCheck;
    /** The TCP peer's address, passed in by the start file; absent on the dev server and in tests. */
    socketAddress?: string;
  }
}
