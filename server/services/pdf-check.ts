// Content checks for uploaded documents: trust the bytes, not the file name or the browser's type.

/**
 * How far from the start the header may sit, and how far from the end the end-of-file marker.
 * ISO 32000-1:2008 §7.5.2 puts the `%PDF-n.m` header on the first line and §7.5.5 puts `%%EOF` on
 * the last line; readers are lenient about bytes before the header and after the marker and look
 * within the first / last 1024 bytes ([memory] PDF Reference 1.7, Appendix H implementation notes).
 */
const WINDOW = 1024;
const HEADER = /%PDF-[0-9]\.[0-9]/;
const EOF_MARKER = Buffer.from('%%EOF', 'latin1');

/** True when the bytes look like a PDF file: a `%PDF-n.m` header near the start and `%%EOF` near the end. */
export function isPdf(buffer: Buffer | Uint8Array): boolean {
  if (!buffer || buffer.length === 0) return false;
  const bytes = Buffer.isBuffer(buffer) ? buffer : Buffer.from(buffer.buffer, buffer.byteOffset, buffer.byteLength);
  const head = bytes.subarray(0, WINDOW).toString('latin1');
  const headerAt = head.search(HEADER);
  if (headerAt < 0) return false;
  const tailStart = Math.max(headerAt + 5, bytes.length - WINDOW);
  return bytes.subarray(tailStart).includes(EOF_MARKER);
}

const MAX_NAME = 100;
const EXTENSION = /^[A-Za-z0-9]{1,10}$/;
const FALLBACK = 'document';

function cleanSegment(text: string): string {
  return text
    .replace(/[^A-Za-z0-9._-]+/g, '-')
    .replace(/\.{2,}/g, '.')
    .replace(/-{2,}/g, '-')
    .replace(/^[.-]+/, '')
    .replace(/[.-]+$/, '');
}

/**
 * A file name reduced to a safe key fragment: the last path segment only, accents folded to
 * ASCII, every other run of characters outside [A-Za-z0-9._-] made one dash, no leading dots or
 * dashes (no hidden files, no `..`, nothing read as an option), at most 100 characters with the
 * extension kept, never empty ("document" stands in for a name with nothing usable).
 */
export function safeStoredName(originalName: string): string {
  const raw = typeof originalName === 'string' ? originalName : '';
  // Both separators: a name from a Windows browser can carry C:\...\ in front.
  const base = (raw.split(/[\\/]/).pop() ?? '').normalize('NFKD').replace(/[\u0300-\u036f]/g, '');
  const dot = base.lastIndexOf('.');
  const extension = dot > 0 && EXTENSION.test(base.slice(dot + 1)) ? base.slice(dot + 1) : '';
  const room = MAX_NAME - (extension ? extension.length + 1 : 0);
  const stem = cleanSegment(cleanSegment(extension ? base.slice(0, dot) : base).slice(0, room)) || FALLBACK;
  return extension ? `${stem}.${extension}` : stem;
}
