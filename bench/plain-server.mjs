// The ceiling: plain node:http answering a fixed body, in its own process (run by bench/http.ts). With a third
// argument it first spins for that many milliseconds per request: the same server with a render's worth of work,
// which shows what the latency at 50 connections looks like for any server that spends that long per answer.
import { createServer } from 'node:http';
import { readFileSync } from 'node:fs';

const [, , port, bodyFile, workMs] = process.argv;
const body = readFileSync(bodyFile);
const work = Number(workMs ?? 0);
createServer((_req, res) => {
  if (work > 0) {
    const until = performance.now() + work;
    while (performance.now() < until);
  }
  res.writeHead(200, { 'content-type': 'text/html; charset=utf-8', 'content-length': body.length });
  res.end(body);
}).listen(Number(port), '127.0.0.1', () => process.send?.('ready'));
