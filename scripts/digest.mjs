#!/usr/bin/env node
// `npm run digest`: asks the running Wakebook server to send the weekly digest now. Meant for a scheduler
// (cron, a systemd timer) on the same machine. Plain Node, no dependencies, so it works in a production install.
//
//   WAKEBOOK_CRON_TOKEN=…  npm run digest [-- --days 7]
//
// It calls POST /api/digest/send on http://127.0.0.1:$PORT (or WAKEBOOK_URL) with the token as a bearer
// secret; the server checks it against its own WAKEBOOK_CRON_TOKEN. Exit code 0 when the digest went out.
const token = process.env.WAKEBOOK_CRON_TOKEN;
if (!token) {
  console.error('digest: set WAKEBOOK_CRON_TOKEN (the same value the server was started with).');
  process.exit(2);
}
const host =
  !process.env.HOST || process.env.HOST === '0.0.0.0' || process.env.HOST === '::' ? '127.0.0.1' : process.env.HOST;
const base = (process.env.WAKEBOOK_URL || `http://${host}:${process.env.PORT || 4321}`).replace(/\/+$/, '');
const i = process.argv.indexOf('--days');
const days = i > 0 ? Number(process.argv[i + 1]) : 7;
if (!Number.isInteger(days) || days < 1 || days > 31) {
  console.error('digest: --days must be a whole number from 1 to 31.');
  process.exit(2);
}

try {
  const res = await fetch(`${base}/api/digest/send`, {
    method: 'POST',
    headers: { authorization: `Bearer ${token}`, 'content-type': 'application/json', accept: 'application/json' },
    body: JSON.stringify({ days }),
    signal: AbortSignal.timeout(5 * 60_000),
  });
  const body = await res.json().catch(() => null);
  if (res.status === 401) {
    console.error('digest: the server did not accept the token. Start the server with the same WAKEBOOK_CRON_TOKEN.');
    process.exit(1);
  }
  if (!res.ok) {
    console.error(`digest: the server answered ${res.status}: ${body?.error?.message ?? 'no details'}`);
    process.exit(1);
  }
  console.log(
    `digest: since ${body.since}: ${body.sent} sent, ${body.skipped} with nothing new, ${body.failed} failed (of ${body.recipients} opted in).`,
  );
  process.exit(body.failed > 0 ? 1 : 0);
} catch (e) {
  console.error(`digest: could not reach ${base} (${e instanceof Error ? e.message : e}). Is the server running?`);
  process.exit(1);
}
