/** File types an upload may have: price, market and risk-free files are CSV text. */
export const UPLOAD_EXTENSIONS = ['.csv', '.txt'] as const;
export const UPLOAD_CONTENT_TYPES = ['text/csv', 'text/plain', 'application/csv', 'application/vnd.ms-excel', 'application/octet-stream'] as const;

const MAX_NAME = 100;

/**
 * A safe file name from whatever the browser sent: the last path segment only, letters, digits,
 * dot, hyphen and underscore (anything else becomes a hyphen), no leading dot or hyphen, at most 100
 * characters with the extension kept. The name is a label in the store's records, never a path.
 */
export function sanitiseFileName(original: string): string {
  const base = original.split(/[\\/]/).pop() ?? '';
  const cleaned = base
    .normalize('NFKD')
    .replace(/[^A-Za-z0-9._-]+/g, '-')
    .replace(/-{2,}/g, '-')
    .replace(/\.{2,}/g, '.')
    .replace(/^[.-]+/, '');
  const dot = cleaned.lastIndexOf('.');
  const extension = dot > 0 ? cleaned.slice(dot).toLowerCase() : '';
  const stem = (dot > 0 ? cleaned.slice(0, dot) : cleaned).replace(/[.-]+$/, '').slice(0, MAX_NAME - extension.length);
  return `${stem === '' ? 'upload' : stem}${extension}`;
}

export function hasAllowedExtension(name: string): boolean {
  const lower = name.toLowerCase();
  return UPLOAD_EXTENSIONS.some((extension) => lower.endsWith(extension));
}

export function hasAllowedContentType(contentType: string): boolean {
  const type = contentType.split(';')[0]?.trim().toLowerCase() ?? '';
  return (UPLOAD_CONTENT_TYPES as readonly string[]).includes(type);
}
