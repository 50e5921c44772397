import { describe, it, expect } from 'vitest';
import { sniffType } from '../../src/lib/server/filetype';

const bytes = (...b: number[]) => new Uint8Array(b);
const text = (s: string) => new TextEncoder().encode(s);

describe('sniffType (type from the bytes, not the name)', () => {
  it('recognises the allowed kinds by their signatures', () => {
    expect(sniffType(bytes(0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0), 'a.bin')?.contentType).toBe('image/png');
    expect(sniffType(bytes(0xff, 0xd8, 0xff, 0xe0), 'a')?.contentType).toBe('image/jpeg');
    expect(sniffType(text('GIF89a....'), 'a')?.contentType).toBe('image/gif');
    expect(sniffType(text('RIFF\0\0\0\0WEBPVP8 '), 'a')?.contentType).toBe('image/webp');
    expect(sniffType(text('%PDF-1.7\n'), 'a')?.contentType).toBe('application/pdf');
    expect(sniffType(text('time_s,temp_C\n0,20\n1,21\n'), 'log.txt')?.contentType).toBe('text/csv');
    expect(sniffType(text('Notes from the tank test.\n'), 'notes.txt')?.contentType).toBe('text/plain');
  });
  it('refuses binaries whatever their name, and SVG or HTML are not images here', () => {
    expect(sniffType(bytes(0x4d, 0x5a, 0x90, 0), 'photo.png')).toBeNull();
    expect(sniffType(bytes(0x7f, 0x45, 0x4c, 0x46), 'log.csv')).toBeNull();
    expect(sniffType(text('<svg onload="alert(1)"></svg>'), 'x.svg')?.contentType).toBe('text/plain');
    expect(sniffType(bytes(), 'empty.csv')).toBeNull();
    expect(sniffType(bytes(0xc3, 0x28), 'bad-utf8.txt')).toBeNull();
  });
});
