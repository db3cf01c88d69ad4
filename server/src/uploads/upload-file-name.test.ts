import { describe, expect, it } from 'vitest';
import { hasAllowedContentType, hasAllowedExtension, sanitiseFileName } from './upload-file-name.js';

describe('sanitiseFileName', () => {
  it('keeps only the last path segment, so a name can never climb out of a folder', () => {
    expect(sanitiseFileName('../../etc/prices-2026-06.csv')).toBe('prices-2026-06.csv');
    expect(sanitiseFileName('C:\\Users\\ops\\prices.csv')).toBe('prices.csv');
  });

  it('replaces spaces, quotes and control characters with single hyphens', () => {
    expect(sanitiseFileName('tarn "equities"  june\u0000.csv')).toBe('tarn-equities-june.csv');
  });

  it('drops a leading dot so the file is never hidden, and lowercases the extension', () => {
    expect(sanitiseFileName('.hidden.CSV')).toBe('hidden.csv');
  });

  it('falls back to "upload" when nothing usable is left, and caps the length at 100', () => {
    expect(sanitiseFileName('日本.csv')).toBe('upload.csv');
    expect(sanitiseFileName(`${'a'.repeat(300)}.csv`)).toHaveLength(100);
  });
});

describe('upload types', () => {
  it('accepts CSV and text files only', () => {
    expect(hasAllowedExtension('prices.CSV')).toBe(true);
    expect(hasAllowedExtension('prices.txt')).toBe(true);
    expect(hasAllowedExtension('prices.xlsx')).toBe(false);
    expect(hasAllowedContentType('text/csv; charset=utf-8')).toBe(true);
    expect(hasAllowedContentType('application/x-msdownload')).toBe(false);
  });
});
