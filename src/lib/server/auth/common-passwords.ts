// The breach list is zxcvbn-ts's "passwords-common" dictionary (MIT), ranked from public breach corpora; we import
// it rather than keep our own copy. Server-only: it is large and an island importing it would ship it.
import { dictionary } from '@zxcvbn-ts/language-common';
import { MIN_PASSWORD_LENGTH } from '../../password-rules';

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
