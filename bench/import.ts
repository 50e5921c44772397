// Importing 100 mixed documents (20 each of Word, PDF, HTML, Markdown and text, all different) through the API of
// the built server: one POST /api/imports, then GET /api/imports/{id} until every file is done. Reports the time to
// the 202, the time until the last file is a draft, files per second, and how quickly the server kept answering
// other requests (GET /api/health) while it converted, and the server's CPU time per file. Needs `npm run build`; run alone with `--only import`.
import { makeDocx, makePdf, makePng } from '../tests/setup/documents';
import { loadavg } from 'node:os';
import { cpuMs } from './load';
import { percentile } from './stats';
import { startBuiltServer, signInCookie } from './server';

const FILES = 100;
const round = (x: number, digits = 2) => Number(x.toFixed(digits));

async function mixedFiles(): Promise<[string, Uint8Array | string][]> {
  const out: [string, Uint8Array | string][] = [];
  const png = makePng(32, 24);
  for (let i = 0; i < FILES; i++) {
    const n = i + 1;
    const para = `Run ${n}: the hull was trimmed ${n % 7} degrees bow down and the wake settled after ${n * 3} metres.`;
    switch (i % 5) {
      case 0:
        out.push([
          `report-${n}.docx`,
          await makeDocx({
            title: `Laminate report ${n}`,
            heading: `Findings ${n}`,
            paragraphs: [para, para.toUpperCase()],
            bullets: [`Check ${n}`, `Measure ${n}`],
            table: [
              ['Layer', 'g/m²'],
              ['Outer', String(200 + n)],
            ],
            image: { png: makePng(8 + (n % 16), 6, [n % 255, 90, 160]), alt: `photo ${n}` },
          }),
        ]);
        break;
      case 1:
        out.push([`test-${n}.pdf`, await makePdf(`Tank test ${n}`, new Date('2025-11-01'), [para, `Speed ${n} m/s.`])]);
        break;
      case 2:
        out.push([
          `page-${n}.html`,
          `<html><head><title>Page ${n}</title></head><body><h1>Page ${n}</h1><p>${para}</p>` +
            `<img src="data:image/png;base64,${png.toString('base64')}" alt="p${n}"><ul><li>a ${n}</li></ul></body></html>`,
        ]);
        break;
      case 3:
        out.push([
          `notes-${n}.md`,
          `# Notes ${n}\n\n${para}\n\n- **bold ${n}**\n- *italic*\n\n| a | b |\n|---|---|\n| ${n} | 2 |\n`,
        ]);
        break;
      default:
        out.push([`log-${n}.txt`, `${para}\n\nSecond paragraph ${n}.`]);
    }
  }
  return out;
}

export default async function benchImport(): Promise<object[]> {
  const files = await mixedFiles();
  const bytes = files.reduce((a, [, b]) => a + (typeof b === 'string' ? Buffer.byteLength(b) : b.byteLength), 0);
  const server = await startBuiltServer(4640);
  try {
    const cookie = await signInCookie(server.base, 'member@wakebook.test');
    const form = new FormData();
    form.set('subsystem', 'hull');
    form.set('kind', 'decision');
    for (const [name, b] of files) form.append('file', new Blob([typeof b === 'string' ? b : new Uint8Array(b)]), name);

    // Meanwhile, someone else's request every 50 ms: how long it waits shows whether the import blocks the server.
    const others: number[] = [];
    let running = true;
    const probe = (async () => {
      while (running) {
        const t = performance.now();
        await fetch(`${server.base}/api/health`).then((r) => r.arrayBuffer());
        others.push(performance.now() - t);
        await new Promise((r) => setTimeout(r, 50));
      }
    })();

    const cpu0 = cpuMs(server.child.pid!);
    const t0 = performance.now();
    const res = await fetch(`${server.base}/api/imports`, {
      method: 'POST',
      headers: { cookie, origin: server.base },
      body: form,
    });
    const accepted = performance.now() - t0;
    if (res.status !== 202) throw new Error(`import refused: ${res.status} ${await res.text()}`);
    const id = ((await res.json()) as { import: { id: string } }).import.id;
    type Item = { state: string; message: string | null };
    let view: { state: string; done: number; items: Item[] };
    for (;;) {
      const got = await fetch(`${server.base}/api/imports/${id}`, { headers: { cookie } });
      view = ((await got.json()) as { import: typeof view }).import;
      if (view.state === 'done') break;
      await new Promise((r) => setTimeout(r, 25));
    }
    const total = performance.now() - t0;
    const cpu = cpuMs(server.child.pid!) - cpu0;
    running = false;
    await probe;
    const states = view.items.reduce<Record<string, number>>(
      (a, i) => ({ ...a, [i.state]: (a[i.state] ?? 0) + 1 }),
      {},
    );
    if (states.done !== FILES)
      throw new Error(
        `not every file became a draft: ${JSON.stringify(states)} ${view.items.find((i) => i.message)?.message}`,
      );
    const sorted = [...others].sort((a, b) => a - b);
    return [
      {
        name: 'import.100-mixed-files',
        n: FILES,
        upload_mb: round(bytes / 1024 / 1024, 3),
        accepted_ms: round(accepted, 1),
        seconds: round(total / 1000, 2),
        files_per_s: round((FILES * 1000) / total, 1),
        // The server's own CPU time per file (steadier than seconds on a shared machine; includes the polling GETs).
        server_cpu_ms_per_file: round(cpu / FILES, 1),
        load_avg_1m: round(loadavg()[0]),
        other_requests: others.length,
        other_p50_ms: round(percentile(sorted, 50), 1),
        other_max_ms: round(sorted[sorted.length - 1] ?? NaN, 1),
        docs: '20 each of .docx (with an image and a table), .pdf, .html (with an inline image), .md and .txt; one POST, polled until done',
      },
    ];
  } finally {
    await server.stop();
  }
}
