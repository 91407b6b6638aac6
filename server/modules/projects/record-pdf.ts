import PDFDocument from 'pdfkit';
import { createRequire } from 'node:module';
import path from 'node:path';
import type { DesignRecordContent } from '../../../shared/schemas/projects';
import { FAMILY_LABELS } from '../../../shared/schemas/catalogue';
import { FAILURE_MODES, modeMargin, type CandidateResult } from '../../../shared/engine';
import { colors, MODE_COLOURS } from '../../../shared/design-tokens';
import { describeInputs, VALUE_STATUS_LABELS } from '../../../shared/schemas/provenance';
import { FAILURE_MODE_LABELS, MARGIN_CHART_RANGE, RECORD_SECTIONS, REFERENCE_KIND_LABELS, factorsText, formatMargin, roundText, sizedByText } from '../../../shared/labels';
import { describeLoadCase } from '../../../shared/load-case-text';
import { shortCandidateLabels } from '../../../shared/candidate-name';
import { formatDateTimeUtc } from '../../../shared/dates';
import { formatQuantity, type QuantityKind } from '../../../shared/units';

/**
 * The design record as a real, text-selectable PDF (pdfkit, DejaVu fonts embedded). It follows the
 * record page section by section, with the same titles (RECORD_SECTIONS) and the same words for
 * the load case (shared/load-case-text.ts), in SI. Every page carries "page n of N".
 */
// DejaVu (shipped as an npm dependency) covers the Greek letters, roots and exponents that the
// engine's model texts use; PDF's built-in Helvetica does not.
const fontDir = path.join(path.dirname(createRequire(import.meta.url).resolve('dejavu-fonts-ttf/package.json')), 'ttf');
const FONTS = {
  regular: path.join(fontDir, 'DejaVuSans.ttf'),
  bold: path.join(fontDir, 'DejaVuSans-Bold.ttf'),
  italic: path.join(fontDir, 'DejaVuSans-Oblique.ttf'),
};

const INK = colors.ink.DEFAULT;
const SOFT = colors.ink.soft;
const LINE = colors.chart.line;
const MARGIN = 48;
/** Room kept below the text for the footer. */
const FOOTER = 22;

const q = (kind: QuantityKind, si: number | null | undefined, unit = true) => formatQuantity(kind, 'SI', si, { unit });
const thickness = (m: number | null) => (m === null ? 'none suffices' : q('length', m));

export function renderDesignRecordPdf(recordId: number, c: DesignRecordContent): Promise<Buffer> {
  const doc = new PDFDocument({
    size: 'A4',
    margins: { top: MARGIN, bottom: MARGIN + FOOTER, left: MARGIN, right: MARGIN },
    bufferPages: true,
    info: {
      Title: `Isobath design record ${recordId}: ${c.shortlist.name}`,
      Author: c.author.name,
      Subject: `${c.project.name} — ${c.loadCase.name}`,
      Creator: 'Isobath',
    },
  });
  doc.registerFont('Body', FONTS.regular);
  doc.registerFont('Body-Bold', FONTS.bold);
  doc.registerFont('Body-Italic', FONTS.italic);
  const chunks: Buffer[] = [];
  doc.on('data', (chunk: Buffer) => chunks.push(chunk));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  const width = doc.page.width - 2 * MARGIN;
  const bottom = () => doc.page.height - doc.page.margins.bottom;
  /** A new page when `height` more would not fit; never a page that would stay empty. */
  const room = (height: number) => {
    if (doc.y + height > bottom() && doc.y > doc.page.margins.top + 1) doc.addPage();
  };

  const heading = (text: string) => {
    room(90);
    doc.moveDown(0.8).font('Body-Bold').fontSize(12).fillColor(INK).text(text, MARGIN);
    doc.moveTo(MARGIN, doc.y + 2).lineTo(MARGIN + width, doc.y + 2).strokeColor(LINE).lineWidth(0.8).stroke();
    doc.moveDown(0.5);
  };
  const subheading = (text: string) => {
    room(60);
    doc.moveDown(0.4).font('Body-Bold').fontSize(10).fillColor(INK).text(text, MARGIN);
    doc.moveDown(0.2);
  };
  const pair = (label: string, value: string) => {
    doc.font('Body-Bold').fontSize(9).fillColor(SOFT).text(`${label}: `, MARGIN, doc.y, { continued: true });
    doc.font('Body').fillColor(INK).text(value);
  };
  const small = (text: string, colour = SOFT, indent = 0) => doc.font('Body').fontSize(8).fillColor(colour).text(text, MARGIN, doc.y, { indent });

  // Title block, as the page's header
  doc.font('Body').fontSize(8).fillColor(SOFT).text(`ISOBATH DESIGN RECORD #${recordId}`);
  doc.font('Body-Bold').fontSize(18).fillColor(INK).text(c.shortlist.name);
  doc.font('Body').fontSize(10).fillColor(SOFT).text(`Project: ${c.project.name} · load case “${c.loadCase.name}”`);
  doc.text(`Frozen ${formatDateTimeUtc(c.frozenAt)} — later catalogue changes do not alter this record. Pressure in MPa, stress in MPa, length in mm.`);

  heading(RECORD_SECTIONS.cautions);
  doc.font('Body').fontSize(9).fillColor(INK).text(c.cautions);

  heading(RECORD_SECTIONS.signOff);
  pair('Prepared and submitted', `${c.author.name} (${c.author.email}), ${formatDateTimeUtc(c.shortlist.submittedAt)}`);
  pair('Checked', `${c.checker.name} (${c.checker.email}), ${formatDateTimeUtc(c.shortlist.checkedAt)}`);
  pair("Checker's comment", c.shortlist.checkComment || 'none');

  if (c.rounds?.length) {
    heading(RECORD_SECTIONS.rounds);
    for (const r of c.rounds) {
      const text = roundText(r, formatDateTimeUtc);
      doc.font('Body-Bold').fontSize(9).fillColor(INK).text(text.heading);
      for (const change of r.changes) small(`• ${change}`, SOFT, 8);
      doc.font('Body').fontSize(9).fillColor(INK).text(text.outcome);
      doc.moveDown(0.3);
    }
  }

  heading(RECORD_SECTIONS.loadCase);
  doc.font('Body-Bold').fontSize(10).fillColor(INK).text(c.loadCase.name);
  pair('Design pressure', `${q('pressure', c.pressure)} gauge`);
  pair('Proof test', `${q('pressure', c.proofTestPressure)} gauge`);
  pair('Pressure method', c.pressureMethod);
  for (const row of describeLoadCase(c.loadCase.input, 'SI')) pair(row.label, row.value);
  if (c.loadCase.notes) small(c.loadCase.notes);

  heading(RECORD_SECTIONS.candidates);
  const cols = [
    { title: '#', w: 16 },
    { title: 'Candidate', w: 160 },
    { title: 'Governed by', w: 62 },
    { title: 'Safety factor', w: 42 },
    { title: 'Target', w: 34 },
    { title: 'Margin', w: 40 },
    { title: 'Required t (mm)', w: 54 },
    { title: 'Mass (kg/m²)', w: 48 },
    { title: 'Warnings', w: 43 },
  ];
  const row = (cells: string[], bold = false, colour?: string) => {
    doc.font(bold ? 'Body-Bold' : 'Body').fontSize(8);
    const heights = cells.map((text, i) => doc.heightOfString(text, { width: cols[i].w - 4 }));
    room(Math.max(...heights) + 3);
    const y = doc.y;
    let x = MARGIN;
    cells.forEach((text, i) => {
      doc.fillColor(i === 2 && colour ? colour : INK).text(text, x, y, { width: cols[i].w - 4 });
      x += cols[i].w;
    });
    doc.x = MARGIN;
    doc.y = y + Math.max(...heights) + 3;
  };
  row(cols.map((col) => col.title), true);
  c.candidates.forEach((cand, i) => {
    const r = cand.result;
    row(
      [
        String(i + 1),
        `${cand.propertySet.material.name}\n${cand.propertySet.condition}`,
        FAILURE_MODE_LABELS[r.governingMode],
        r.safetyFactor.toFixed(2),
        r.targetSafetyFactor.toFixed(2),
        formatMargin(r.margin),
        r.requiredThickness === null ? 'none suffices' : q('length', r.requiredThickness, false),
        q('massPerArea', r.massPerArea, false),
        r.warnings.length ? String(r.warnings.length) : '—',
      ],
      false,
      MODE_COLOURS[r.governingMode],
    );
  });

  heading(RECORD_SECTIONS.margins);
  drawMarginChart(doc, c.candidates.map((x) => x.result), width, room);

  heading(RECORD_SECTIONS.modes);
  c.candidates.forEach((cand, index) => {
    const r = cand.result;
    subheading(`${index + 1}. ${r.name}`);
    pair('Note', cand.note || 'none');
    for (const m of r.modes) {
      room(40);
      doc.font('Body-Bold').fontSize(8.5).fillColor(MODE_COLOURS[m.mode]).text(`${FAILURE_MODE_LABELS[m.mode]}${m.check ? ` (${m.check})` : ''}: `, MARGIN, doc.y, { continued: true });
      doc
        .font('Body')
        .fillColor(INK)
        .text(
          `stress ${q('stress', m.stress)}, allowable ${q('stress', m.allowable)}, safety factor ${m.safetyFactor.toFixed(2)}, needs t ${thickness(m.requiredThickness)}` +
            (m.proof ? `; at proof ${m.proof.safetyFactor.toFixed(2)}` : '') +
            (m.collapse
              ? `; elastic ${Number.isFinite(m.collapse.elastic) ? q('pressure', m.collapse.elastic) : '—'} · yield ${q('pressure', m.collapse.yield)} → collapse ${q('pressure', m.collapse.collapse)}`
              : ''),
        );
      doc.font('Body-Italic').fontSize(7.5).fillColor(SOFT).text(`Model and source: ${m.model}`, MARGIN, doc.y, { indent: 10 });
    }
    doc.moveDown(0.3);
    sizing(r);
    doc.font('Body').fontSize(8.5).fillColor(INK).text(factorsText(r.factors), MARGIN);
    if (r.warnings.length) {
      doc.moveDown(0.2).font('Body-Bold').fontSize(8.5).fillColor(colors.verdict.watch).text('Warnings', MARGIN);
      for (const w of r.warnings) small(`• ${w}`, INK, 6);
    } else small('No warnings for this load case.');
    doc.moveDown(0.4);
  });

  heading(RECORD_SECTIONS.sources);
  c.candidates.forEach((cand, index) => {
    const set = cand.propertySet;
    room(80);
    doc.font('Body-Bold').fontSize(9).fillColor(INK).text(`${index + 1}. ${set.material.name}`, MARGIN);
    small(set.condition);
    small(`Property set #${set.id}, version ${set.version} · ${FAMILY_LABELS[set.material.family]}`);
    const inputs = describeInputs(set);
    for (const v of inputs) small(`${v.label}: ${VALUE_STATUS_LABELS[v.status]}${v.detail ? ` — ${v.detail}` : ''}`, v.status === 'confirmed' ? INK : colors.verdict.watch, 6);
    const ref = set.reference;
    if (ref) {
      doc.moveDown(0.2).font('Body-Bold').fontSize(8.5).fillColor(colors.brass.DEFAULT).text(`${REFERENCE_KIND_LABELS[ref.kind]}${ref.identifier ? ` · ${ref.identifier}` : ''}`, MARGIN);
      doc.font('Body-Bold').fontSize(8.5).fillColor(INK).text(ref.title, MARGIN);
      small(`${[ref.authors, ref.year].filter(Boolean).join(', ')}${ref.location ? ` — ${ref.location}` : ''}`);
      if (ref.note) small(ref.note);
      // Records frozen before references were versioned cite version 1 and name no document version.
      small(`Citation version ${ref.version ?? 1}${ref.documentVersion ? `, document version ${ref.documentVersion}` : ''} (as frozen)`);
    } else doc.font('Body').fontSize(8.5).fillColor(colors.verdict.fail).text('No reference was recorded for this set.', MARGIN);
    doc.moveDown(0.5);
  });

  heading(RECORD_SECTIONS.models);
  for (const model of c.engine.models) small(`• ${model}`, INK);
  doc.moveDown(0.3);
  small(`Record format ${c.format} v${c.formatVersion}, frozen ${formatDateTimeUtc(c.frozenAt)} from shortlist #${c.shortlist.id}.`);

  // Footers, written inside the page's own bottom margin: with the margin in force pdfkit would
  // start a new page for each footer.
  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    const keep = doc.page.margins.bottom;
    doc.page.margins.bottom = 0;
    doc.font('Body').fontSize(7).fillColor(SOFT).text(
      `Isobath design record ${recordId} · ${c.project.name} · page ${i + 1 - range.start} of ${range.count} · screening estimate; see cautions`,
      MARGIN,
      doc.page.height - MARGIN,
      { width, align: 'center', lineBreak: false },
    );
    doc.page.margins.bottom = keep;
  }
  doc.end();
  return done;

  /** What sized the result, as the page's sizing summary says it. */
  function sizing(r: CandidateResult) {
    if (r.coverage) pair('Human occupancy', r.coverage === 'covered' ? 'covered by a window rule' : 'NOT covered by any window rule in the catalogue');
    pair('Required thickness', `${thickness(r.requiredThickness)}; thickness set by ${sizedByText(r.sizedBy ?? null)}`);
    const rt = r.rating;
    if (rt) {
      pair(
        'Rating table',
        rt.requiredThickness === null
          ? `${rt.name}: ${rt.outside ?? 'no number'}`
          : `${rt.name}: minimum ratio ${rt.minimumRatio?.toFixed(3)} → ${q('length', rt.requiredThickness)}; rated ${rt.ratedPressure === null ? 'below the table at the entered thickness' : `${rt.ratedPressureIsLowerBound ? 'at least ' : ''}${q('pressure', rt.ratedPressure)}`}${rt.crossCheckSafetyFactor !== null ? `; analytical cross-check safety factor ${rt.crossCheckSafetyFactor.toFixed(2)} at that thickness` : ''}`,
      );
      pair('Table source', rt.source);
      doc.font('Body-Italic').fontSize(7.5).fillColor(SOFT).text(rt.interpolation, MARGIN, doc.y, { indent: 10 });
    }
    if (r.proofSafetyFactor !== undefined) pair('Proof test', `lowest safety factor ${r.proofSafetyFactor.toFixed(2)} against short-term strength`);
  }
}

/** The margins chart as vectors: the page's axis (MARGIN_CHART_RANGE) and its short labels. */
function drawMarginChart(doc: PDFKit.PDFDocument, results: CandidateResult[], width: number, room: (h: number) => void) {
  const modes = FAILURE_MODES.filter((m) => results.some((r) => r.modes.some((x) => x.mode === m)));
  const labels = shortCandidateLabels(results);
  const labelW = 170;
  const chartW = width - labelW - 10;
  const { min, max } = MARGIN_CHART_RANGE;
  const scale = (margin: number) => ((Math.max(min, Math.min(margin, max)) - min) / (max - min)) * chartW;
  const left = MARGIN + labelW;
  const zeroX = left + scale(0);
  results.forEach((r, i) => {
    const needed = Math.max(modes.length * 7 + 8, 20);
    room(needed);
    const top = doc.y;
    doc.font('Body').fontSize(7.5).fillColor(INK).text(labels[i], MARGIN, top, { width: labelW - 6, height: needed, ellipsis: true });
    modes.forEach((mode, j) => {
      const margin = modeMargin(r, mode);
      if (margin === undefined) return;
      const x0 = Math.min(zeroX, left + scale(margin));
      const w = Math.abs(left + scale(margin) - zeroX);
      doc.rect(x0, top + j * 7, Math.max(w, 0.5), 5.5).fillColor(MODE_COLOURS[mode]).fill();
    });
    doc.moveTo(zeroX, top - 2).lineTo(zeroX, top + needed - 4).strokeColor(INK).lineWidth(0.8).stroke();
    doc.x = MARGIN;
    doc.y = top + needed;
  });
  room(30);
  doc
    .font('Body')
    .fontSize(7)
    .fillColor(SOFT)
    .text(`Margin = safety factor / target − 1; the line marks the target (0); bars clipped at ${formatMargin(min)} and ${formatMargin(max)}.`, MARGIN, doc.y + 2);
  doc.moveDown(0.3);
  const y = doc.y;
  let lx = MARGIN;
  for (const mode of modes) {
    doc.rect(lx, y + 1, 8, 6).fillColor(MODE_COLOURS[mode]).fill();
    doc.fillColor(INK).fontSize(7.5).text(FAILURE_MODE_LABELS[mode], lx + 11, y, { lineBreak: false });
    lx += 80;
  }
  doc.x = MARGIN;
  doc.y = y + 12;
}
