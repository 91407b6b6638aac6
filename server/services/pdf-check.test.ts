import { describe, expect, it } from 'vitest';
import { isPdf, safeStoredName } from './pdf-check';

/**
 * A one-page PDF written out by hand, with a cross-reference table whose offsets are computed
 * here (ISO 32000-1:2008 §7.5: header, body, xref table, trailer, startxref, %%EOF).
 */
function minimalPdf(): Buffer {
  const objects = [
    '<< /Type /Catalog /Pages 2 0 R >>',
    '<< /Type /Pages /Kids [3 0 R] /Count 1 >>',
    '<< /Type /Page /Parent 2 0 R /MediaBox [0 0 595 842] /Contents 4 0 R /Resources << /Font << /F1 5 0 R >> >> >>',
    null, // the content stream, below
    '<< /Type /Font /Subtype /Type1 /BaseFont /Helvetica >>',
  ];
  const content = 'BT /F1 18 Tf 72 770 Td (Harrow Sound Marine Works: viewport drawing) Tj ET';
  objects[3] = `<< /Length ${Buffer.byteLength(content, 'latin1')} >>\nstream\n${content}\nendstream`;
  // Header line plus a comment line of high-bit bytes, which marks the file as binary (§7.5.2).
  let out = '%PDF-1.4\n%\u00e2\u00e3\u00cf\u00d3\n';
  const offsets: number[] = [];
  objects.forEach((body, i) => {
    offsets.push(Buffer.byteLength(out, 'latin1'));
    out += `${i + 1} 0 obj\n${body}\nendobj\n`;
  });
  const xrefAt = Buffer.byteLength(out, 'latin1');
  out += `xref\n0 ${objects.length + 1}\n0000000000 65535 f \n`;
  for (const offset of offsets) out += `${String(offset).padStart(10, '0')} 00000 n \n`;
  out += `trailer\n<< /Size ${objects.length + 1} /Root 1 0 R >>\nstartxref\n${xrefAt}\n%%EOF\n`;
  return Buffer.from(out, 'latin1');
}

describe('isPdf', () => {
  it('accepts a complete minimal PDF', () => {
    expect(isPdf(minimalPdf())).toBe(true);
  });

  it('accepts the same bytes given as a plain Uint8Array', () => {
    const pdf = minimalPdf();
    expect(isPdf(new Uint8Array(pdf))).toBe(true);
  });

  it('accepts a header preceded by junk within the first 1024 bytes ([memory] PDF Reference 1.7, Appendix H)', () => {
    expect(isPdf(Buffer.concat([Buffer.alloc(600, 0x20), minimalPdf()]))).toBe(true);
  });

  it('accepts trailing bytes after %%EOF when the marker is within the last 1024 bytes', () => {
    expect(isPdf(Buffer.concat([minimalPdf(), Buffer.from('\r\n\n  \n')]))).toBe(true);
  });

  it('rejects a header that starts past the first 1024 bytes', () => {
    expect(isPdf(Buffer.concat([Buffer.alloc(1100, 0x20), minimalPdf()]))).toBe(false);
  });

  it('rejects a PNG (signature 89 50 4E 47 0D 0A 1A 0A, W3C PNG specification §5.2)', () => {
    const png = Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), Buffer.alloc(64, 0)]);
    expect(isPdf(png)).toBe(false);
  });

  it('rejects an empty buffer', () => {
    expect(isPdf(Buffer.alloc(0))).toBe(false);
  });

  it('rejects a text file named like a PDF: the name is not looked at', () => {
    const notes = Buffer.from('Harrow Sound chamber viewport notes.pdf\nflat disc, cast acrylic, 5 bar\n');
    expect(isPdf(notes)).toBe(false);
  });

  it('rejects a PDF cut off before its end-of-file marker (an interrupted upload)', () => {
    const pdf = minimalPdf();
    expect(isPdf(pdf.subarray(0, pdf.length - 20))).toBe(false);
  });

  it('rejects a bare header with no version number', () => {
    expect(isPdf(Buffer.from('%PDF-\n%%EOF\n'))).toBe(false);
  });

  it('rejects a %%EOF that only appears before 1024 bytes of other trailing content', () => {
    expect(isPdf(Buffer.concat([minimalPdf(), Buffer.alloc(2000, 0x41)]))).toBe(false);
  });
});

describe('safeStoredName', () => {
  it.each([
    ['Harrow Sound viewport drawing rev B.pdf', 'Harrow-Sound-viewport-drawing-rev-B.pdf'],
    ['C:\\Users\\crew\\Camera housing 4000 m.PDF', 'Camera-housing-4000-m.PDF'],
    ['../../etc/passwd', 'passwd'],
    ['/var/tmp/chamber-5bar_flat-viewport.pdf', 'chamber-5bar_flat-viewport.pdf'],
    ['.htaccess', 'htaccess'],
    ['-rf.pdf', 'rf.pdf'],
    ['Ünterwasser Fenster.pdf', 'Unterwasser-Fenster.pdf'],
    ['a\u0000b.pdf', 'a-b.pdf'],
    ['na..me.pdf', 'na.me.pdf'],
    ['hull.report.tar.gz', 'hull.report.tar.gz'],
    ['name.', 'name'],
  ])('%j becomes %j', (input, expected) => {
    expect(safeStoredName(input)).toBe(expected);
  });

  it.each([[''], ['..'], ['.'], ['a/b/'], ['   '], ['日本語']])('%j with nothing usable becomes "document"', (input) => {
    expect(safeStoredName(input)).toBe('document');
  });

  it('keeps the extension when only the extension survives', () => {
    expect(safeStoredName('日本語.pdf')).toBe('document.pdf');
    expect(safeStoredName('...pdf')).toBe('document.pdf');
  });

  it('limits the length to 100 characters and keeps the extension', () => {
    const name = safeStoredName(`${'x'.repeat(300)}.pdf`);
    expect(name).toHaveLength(100);
    expect(name.endsWith('.pdf')).toBe(true);
    expect(safeStoredName('y'.repeat(300))).toHaveLength(100);
  });

  it('only ever returns letters, digits, dot, dash and underscore, never starting with a dot or dash', () => {
    const awkward = ['..\\..\\x', 'a/../../b.pdf', '\u202eevil.pdf', 'tab\tname.pdf', 'quote"\'<>.pdf', '%2e%2e%2f.pdf', '~/.ssh/id', ' lead.pdf '];
    for (const input of awkward) {
      const out = safeStoredName(input);
      expect(out, input).toMatch(/^[A-Za-z0-9_][A-Za-z0-9._-]*$/);
      expect(out, input).not.toContain('..');
      expect(out.length, input).toBeLessThanOrEqual(100);
    }
  });
});
