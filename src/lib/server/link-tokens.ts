import { HttpError } from './http';

/** Why an e-mailed link no longer works; each has its own sentence on the page and in the API error. */
export type SpentReason = 'used' | 'expired' | 'revoked';

const MESSAGES: Record<SpentReason | 'unknown', string> = {
  unknown: 'That link is not valid. Check that you copied the whole address from the e-mail.',
  used: 'That link has already been used. Each link works once.',
  expired: 'That link has expired.',
  revoked: 'That invitation was withdrawn by a team lead.',
};

export function linkMessage(reason: SpentReason | 'unknown'): string {
  return MESSAGES[reason];
}

/** 404 for a token we never issued, 400 (with the reason) for one that was used, expired or revoked (API.md). */
export function linkError(reason: SpentReason | 'unknown'): HttpError {
  if (reason === 'unknown')
    return new HttpError(404, 'not_found', MESSAGES.unknown, [{ path: 'token', message: MESSAGES.unknown }]);
  return new HttpError(400, 'invalid_input', MESSAGES[reason], [{ path: 'token', message: MESSAGES[reason] }], {
    reason,
  });
}
