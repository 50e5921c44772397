/// <reference types="astro/client" />

declare namespace App {
  interface Locals {
    user: import('lucia').User | null;
    session: import('lucia').Session | null;
    /** Set by markCacheable(): the answer depends only on the person, the URL and the stored data. */
    cacheable?: boolean;
    /** The TCP peer's address, passed in by the start file (scripts/start.mjs); absent on the dev server and in tests. */
    socketAddress?: string;
  }
}
