// What a new password must be: long (NIST SP 800-63B asks for length, not character classes) and not on a list
// of passwords known from breaches. The lengths live here, pure, so forms can state them; the list itself is
// server-only (lib/server/auth/common-passwords.ts) because importing it would ship it to the browser.

export const MIN_PASSWORD_LENGTH = 12;
export const MAX_PASSWORD_LENGTH = 256;
