import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { sniffType, startSniffing } from '../../src/lib/server/filetype';

const bytes = (...b: number[]) => new Uint8Array(b);
const text = (s: string) => new TextEncoder().encode(s);
const typeOf = async (b: Uint8Array, name: string) => (await sniffType(b, name))?.contentType ?? null;

describe('sniffType (type from the bytes, not the name)', () => {
  it('recognises the allowed kinds by their signatures', async () => {
    expect(
      await typeOf(new Uint8Array(readFileSync('content/demo/attachments/thrust-vs-rpm-2026-03.png')), 'a.bin'),
    ).toBe('image/png');
    // A PNG signature and the start of its first (IHDR) chunk, which every PNG has.
    const png = bytes(0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52, 0, 0, 0, 1);
    expect(await typeOf(png, 'a.bin')).toBe('image/png');
    expect(await typeOf(bytes(0xff, 0xd8, 0xff, 0xe0), 'a')).toBe('image/jpeg');
    expect(await typeOf(text('GIF89a....'), 'a')).toBe('image/gif');
    expect(await typeOf(text('RIFF\0\0\0\0WEBPVP8 '), 'a')).toBe('image/webp');
    expect(await typeOf(text('%PDF-1.7\n'), 'a')).toBe('application/pdf');
    expect(await typeOf(text('time_s,temp_C\n0,20\n1,21\n'), 'log.txt')).toBe('text/csv');
    expect(await typeOf(text('Notes from the tank test.\n'), 'notes.txt')).toBe('text/plain');
  });
  it('refuses binaries whatever their name, and SVG or HTML are not images here', async () => {
    expect(await typeOf(bytes(0x4d, 0x5a, 0x90, 0), 'photo.png')).toBeNull();
    expect(await typeOf(bytes(0x7f, 0x45, 0x4c, 0x46), 'log.csv')).toBeNull();
    expect(await typeOf(text('<svg onload="alert(1)"></svg>'), 'x.svg')).toBe('text/plain');
    expect(await typeOf(text('<?xml version="1.0"?><svg></svg>'), 'x.svg')).toBe('text/plain');
    expect(await typeOf(bytes(), 'empty.csv')).toBeNull();
    expect(await typeOf(bytes(0xc3, 0x28), 'bad-utf8.txt')).toBeNull();
    // A zip (an .xlsx, say) is a known format but not an allowed one.
    expect(await typeOf(bytes(0x50, 0x4b, 0x03, 0x04, 0x14, 0, 0, 0, 8, 0), 'log.csv')).toBeNull();
  });
  it('fed in chunks, judges the whole file: a NUL far past the head makes it binary, a split UTF-8 sequence does not', async () => {
    const lines = text('time_s,temp_C\n'.concat('1,21\n'.repeat(20_000)));
    const sniffer = startSniffing();
    sniffer.push(lines);
    sniffer.push(bytes(0x30, 0x00, 0x0a));
    expect(await sniffer.finish('log.csv')).toBeNull();

    const word = text('Prüfstand ');
    const split = word.indexOf(0xc3) + 1; // between the two bytes of "ü"
    const ok = startSniffing();
    for (let i = 0; i < 1000; i++) {
      ok.push(word.subarray(0, split));
      ok.push(word.subarray(split));
    }
    expect((await ok.finish('notes.txt'))?.contentType).toBe('text/plain');

    const cut = startSniffing();
    cut.push(word.subarray(0, split)); // ends inside a character
    expect(await cut.finish('notes.txt')).toBeNull();
  });
});
