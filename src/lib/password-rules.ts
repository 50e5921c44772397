// What a new password must be: long (NIST SP 800-63B asks for length, not character classes) and not on a list
// of passwords known from breaches. The list is zxcvbn-ts's "passwords-common" dictionary (MIT), ranked from
// public breach corpora; we import it rather than keep our own copy.
import { dictionary } from '@zxcvbn-ts/language-common';

export const MIN_PASSWORD_LENGTH = 12;
export const MAX_PASSWORD_LENGTH = 256;

let common: Set<string> | undefined;

/** Shorter entries can never pass the length rule, so only the long ones are kept in memory. */
function commonPasswords(): Set<string> {
  common ??= new Set(dictionary['passwords-common'].filter((p) => p.length >= MIN_PASSWORD_LENGTH));
  return common;
}

/** True for a password on the breach list, or one made of a single repeated character or the app's own name. */
export function isCommonPassword(password: string): boolean {
  const lower = password.toLowerCase();
  if (commonPasswords().has(lower)) return true;
  if (/^(.)\1*$/.test(lower)) return true;
  const stripped = lower.replace(/[^a-z]/g, '');
  return stripped === 'wakebook' || stripped === 'wakebookdemo';
}
