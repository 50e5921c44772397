import { z } from 'zod';

// Control characters (NUL above all) and UTF-16 halves without their partner cannot be shown, printed or exported
// faithfully (a lone surrogate is not valid UTF-8), and nobody types them on purpose: refuse them.
const CONTROL = /[\u0000-\u001f\u007f]/;
const CONTROL_EXCEPT_LINES = /[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f]/;
const LONE_SURROGATE = /[\ud800-\udbff](?![\udc00-\udfff])|(?<![\ud800-\udbff])[\udc00-\udfff]/;

/**
 * A line someone types: a title or a name. Refuses control characters and lone surrogates with a 400 on the field;
 * chain `.trim().min().max()` as with `z.string()`.
 */
export function typedLine() {
  return (
    z
      .string()
      // Tested after trimming, so a stray trailing line break (which .trim() removes) is not refused.
      .refine((s) => !CONTROL.test(s.trim()), 'Remove the control characters (such as tabs or NUL) from this text.')
      .refine((s) => !LONE_SURROGATE.test(s), 'This text contains a broken character; type it again.')
  );
}

/** Text of several lines someone types (a comment, a note): line breaks and tabs are fine, other controls not. */
export function typedText() {
  return z
    .string()
    .refine((s) => !CONTROL_EXCEPT_LINES.test(s), 'Remove the control characters (such as NUL) from this text.')
    .refine((s) => !LONE_SURROGATE.test(s), 'This text contains a broken character; type it again.');
}
