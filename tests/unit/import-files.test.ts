import { describe, it, expect } from 'vitest';
import {
  fileSize,
  IMPORT_ACCEPT,
  importProgress,
  limitsInWords,
  problemWith,
  problemWithAll,
} from '../../src/lib/import-files';
import { IMPORT_EXTENSIONS } from '../../src/lib/domain';

const limits = { fileMb: 20, zipMb: 200, totalMb: 500, files: 3 };
const MB = 1024 * 1024;

describe('what the import page checks before sending', () => {
  it('offers in the picker exactly the endings the server reads', () => {
    expect(IMPORT_ACCEPT.split(',')).toEqual(IMPORT_EXTENSIONS.map((e) => `.${e}`));
  });

  it('lets a readable file within its limit go, in any letter case', () => {
    expect(problemWith({ name: 'Report.DOCX', size: 10 * MB }, limits)).toBeNull();
    expect(problemWith({ name: 'archive.zip', size: 150 * MB }, limits)).toBeNull();
  });

  it('names the file and the reason when it would be refused', () => {
    expect(problemWith({ name: 'photo.png', size: 10 }, limits)).toMatch(/^photo\.png is not a file an import reads/);
    expect(problemWith({ name: 'notes', size: 10 }, limits)).toMatch(/^notes is not a file/);
    expect(problemWith({ name: 'empty.md', size: 0 }, limits)).toBe('empty.md is empty.');
    expect(problemWith({ name: 'big.pdf', size: 20 * MB + 1 }, limits)).toBe(
      'big.pdf is over 20 MB, the largest file an import takes.',
    );
    expect(problemWith({ name: 'big.zip', size: 200 * MB + 1 }, limits)).toBe(
      'big.zip is over 200 MB, the largest zip an import takes.',
    );
  });

  it('refuses too many files, or too many bytes together', () => {
    expect(problemWithAll([{ size: 1 }, { size: 1 }, { size: 1 }], limits)).toBeNull();
    expect(problemWithAll([{ size: 1 }, { size: 1 }, { size: 1 }, { size: 1 }], limits)).toBe(
      'Choose at most 3 files for one import.',
    );
    expect(problemWithAll([{ size: 300 * MB }, { size: 201 * MB }], limits)).toBe(
      'Together these files are 501 MB; one import takes up to 500 MB.',
    );
  });

  it('says sizes and limits in words', () => {
    expect([fileSize(512), fileSize(2048), fileSize(1.5 * MB), fileSize(42 * MB)]).toEqual([
      '512 B',
      '2 kB',
      '1.5 MB',
      '42 MB',
    ]);
    expect(limitsInWords(limits).join(' ')).toContain('Up to 3 files in one import');
  });
});

describe('the progress an import list shows', () => {
  it('counts files done of total while running or queued, and says finished once done', () => {
    expect(importProgress({ state: 'queued', done: 0, total: 3 })).toBe('0 of 3 done');
    expect(importProgress({ state: 'running', done: 2, total: 3 })).toBe('2 of 3 done');
    expect(importProgress({ state: 'done', done: 3, total: 3 })).toBe('finished');
  });
});
