import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';

/** All text of a PDF, page by page, read with pdfjs-dist (a full PDF parser). */
export async function pdfText(data: Buffer): Promise<{ pages: number; text: string }> {
  const doc = await getDocument({ data: new Uint8Array(data), useSystemFonts: false, isEvalSupported: false }).promise;
  const parts: string[] = [];
  for (let i = 1; i <= doc.numPages; i++) {
    const page = await doc.getPage(i);
    const content = await page.getTextContent();
    parts.push(content.items.map((item) => ('str' in item ? item.str : '')).join(' '));
  }
  await doc.destroy();
  return { pages: doc.numPages, text: parts.join('\n') };
}
