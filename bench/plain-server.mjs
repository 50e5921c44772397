// The ceiling: plain node:http answering a fixed body, in its own process (run by bench/http.ts).
import { createServer } from 'node:http';
import { readFileSync } from 'node:fs';

const [, , port, bodyFile] = process.argv;
const body = readFileSync(bodyFile);
createServer((_req, res) => {
  res.writeHead(200, { 'content-type': 'text/html; charset=utf-8', 'content-length': body.length });
  res.end(body);
}).listen(Number(port), '127.0.0.1', () => process.send?.('ready'));
