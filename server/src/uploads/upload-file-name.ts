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
  const dot = base.lastIndexOf('.');
  const rawExtension = dot >= 0 ? base.slice(dot + 1) : '';
  const extension = /^[A-Za-z0-9]{1,10}$/.test(rawExtension) ? `.${rawExtension.toLowerCase()}` : '';
  const stem = (extension ? base.slice(0, dot) : base)
    .normalize('NFKD')
    .replace(/[^A-Za-z0-9._-]+/g, '-')
    .replace(/-{2,}/g, '-')
    .replace(/\.{2,}/g, '.')
    .replace(/^[.-]+|[.-]+$/g, '')
    .slice(0, MAX_NAME - extension.length)
    .replace(/[.-]+$/, '');
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
