import PDFDocument from 'pdfkit';
import { createRequire } from 'node:module';
import path from 'node:path';
import type { DesignRecordContent } from '../../../shared/schemas/projects';
import { FAILURE_MODES, modeMargin } from '../../../shared/engine';
import { colors, MODE_COLOURS } from '../../../shared/design-tokens';
import { describeInputs, VALUE_STATUS_LABELS } from '../../../shared/schemas/provenance';
import { COMPONENT_LABELS, FAILURE_MODE_LABELS, factorsText, formatMargin, roundText, sizedByText } from '../../../shared/labels';

/**
 * The design record as a real, text-selectable PDF (pdfkit, DejaVu fonts embedded): sign-off,
 * load case, ranking, a margin chart drawn as vectors, each candidate's modes with their
 * models, warnings and data sources, and the cautions.
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

const mpa = (pa: number) => `${(pa / 1e6).toFixed(pa < 1e7 ? 3 : 1)} MPa`;
const mm = (m: number | null) => (m === null ? 'none suffices' : `${(m * 1000).toFixed(1)} mm`);
const date = (iso: string) => new Date(iso).toISOString().replace('T', ' ').slice(0, 16) + ' UTC';

function describeComponent(c: DesignRecordContent['loadCase']['input']['component']): string {
  const label = COMPONENT_LABELS[c.type];
  switch (c.type) {
    case 'flat-disc':
      return `${label}, unsupported diameter ${mm(c.diameter)}, thickness ${mm(c.thickness)}, edge ${c.edge}`;
    case 'conical-frustum':
      return (
        `${label}, minor diameter ${mm(c.minorDiameter)}, thickness ${mm(c.thickness)}, included angle ${c.includedAngle}°` +
        (c.seatOuterDiameter !== undefined ? `, seat outer diameter ${mm(c.seatOuterDiameter)}` : '')
      );
    case 'spherical-sector':
      return `${label}, inner spherical radius ${mm(c.innerRadius)}, thickness ${mm(c.thickness)}, included angle ${c.includedAngle}°`;
    case 'sphere':
      return `${label} (${c.fabrication ?? 'fabricated'}), inner radius ${mm(c.innerRadius)}, thickness ${mm(c.thickness)}${c.localRadiusRatio ? `, measured local radius ${c.localRadiusRatio} × R` : ''}`;
    case 'cylinder':
      return `${label}, inner radius ${mm(c.innerRadius)}, thickness ${mm(c.thickness)}, unsupported length ${mm(c.length)}${c.outOfRoundness ? `, out-of-roundness ${(c.outOfRoundness * 100).toFixed(2)} % of R` : ''}`;
    case 'ring-stiffened-cylinder': {
      const f = c.frame;
      const frame =
        f.shape === 'tee'
          ? `tee frames ${mm(f.webHeight)} × ${mm(f.webThickness)} web, ${mm(f.flangeWidth)} × ${mm(f.flangeThickness)} flange`
          : `frames of area ${(f.area * 1e6).toFixed(0)} mm², second moment ${(f.secondMoment * 1e12).toExponential(3)} mm⁴, depth ${mm(f.depth)}`;
      return `${label}, inner radius ${mm(c.innerRadius)}, shell thickness ${mm(c.thickness)}, ${c.framePosition} ${frame} at ${mm(c.frameSpacing)}, ${mm(c.length)} between bulkheads, out-of-roundness ${((c.outOfRoundness ?? 0.005) * 100).toFixed(2)} % of R`;
    }
  }
}

function describePressure(p: DesignRecordContent['loadCase']['input']['pressure']): string {
  return 'value' in p ? `Given directly: ${mpa(p.value)}` : `${p.depth} m in ${p.water === 'sea' ? 'seawater' : 'fresh water'} at latitude ${p.latitude}°`;
}

export function renderDesignRecordPdf(recordId: number, c: DesignRecordContent): Promise<Buffer> {
  const doc = new PDFDocument({
    size: 'A4',
    margins: { top: MARGIN, bottom: MARGIN, left: MARGIN, right: MARGIN },
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

  const heading = (text: string) => {
    if (doc.y > doc.page.height - 140) doc.addPage();
    doc.moveDown(0.8).font('Body-Bold').fontSize(12).fillColor(INK).text(text);
    doc.moveTo(MARGIN, doc.y + 2).lineTo(MARGIN + width, doc.y + 2).strokeColor(LINE).lineWidth(0.8).stroke();
    doc.moveDown(0.5);
  };
  const pair = (label: string, value: string) => {
    doc.font('Body-Bold').fontSize(9).fillColor(SOFT).text(`${label}: `, { continued: true });
    doc.font('Body').fillColor(INK).text(value);
  };

  // Title block
  doc.font('Body-Bold').fontSize(18).fillColor(INK).text('Isobath design record');
  doc.font('Body').fontSize(11).fillColor(SOFT).text(`${c.project.name} · ${c.shortlist.name} · record ${recordId}`);
  doc.moveDown(0.6);
  pair('Author', `${c.author.name}, submitted ${date(c.shortlist.submittedAt)}`);
  pair('Checker', `${c.checker.name}, checked ${date(c.shortlist.checkedAt)}`);
  if (c.shortlist.checkComment) pair("Checker's comment", c.shortlist.checkComment);
  pair('Frozen', `${date(c.frozenAt)} — later catalogue changes do not alter this record`);

  if (c.rounds?.length) {
    heading('Rounds of checking');
    for (const r of c.rounds) {
      const text = roundText(r, date);
      doc.font('Body-Bold').fontSize(9).fillColor(INK).text(text.heading);
      for (const change of r.changes) doc.font('Body').fontSize(8.5).fillColor(SOFT).text(`  • ${change}`);
      doc.font('Body').fontSize(9).fillColor(INK).text(text.outcome);
      doc.moveDown(0.3);
    }
  }

  heading('Cautions');
  doc.font('Body').fontSize(9).fillColor(INK).text(c.cautions);

  heading(`Load case: ${c.loadCase.name}`);
  const lc = c.loadCase.input;
  pair('Pressure', describePressure(lc.pressure));
  pair('Design pressure', `${mpa(c.pressure)} gauge; proof test ${mpa(c.proofTestPressure)} (factor ${lc.proofFactor})`);
  pair('Pressure method', c.pressureMethod);
  pair('Design temperatures', `${lc.temperature.min} °C to ${lc.temperature.max} °C`);
  pair('Sustained load', `${lc.sustainedHours} h; pressure cycles ${lc.cycles}`);
  pair('Target safety factor', lc.targetSafetyFactor ? String(lc.targetSafetyFactor) : "each family's default (common practice)");
  pair('Component', describeComponent(lc.component));
  if (lc.humanOccupancy) pair('Human occupancy', 'yes: windows no rule covers are marked and ranked below covered ones');
  if (c.loadCase.notes) pair('Notes', c.loadCase.notes);

  heading('Candidates, best first by governing margin');
  const ranked = [...c.candidates].sort((a, b) => b.result.margin - a.result.margin);
  const cols = [
    { title: '#', w: 18 },
    { title: 'Candidate', w: 170 },
    { title: 'Governed by', w: 66 },
    { title: 'SF', w: 36 },
    { title: 'Target', w: 36 },
    { title: 'Margin', w: 44 },
    { title: 'Required t', w: 64 },
    { title: 'kg/m²', w: 50 },
  ];
  const row = (cells: string[], bold = false, colour?: string) => {
    const y = doc.y;
    let x = MARGIN;
    let h = 0;
    doc.font(bold ? 'Body-Bold' : 'Body').fontSize(8.5);
    cells.forEach((text, i) => {
      doc.fillColor(i === 2 && colour ? colour : INK).text(text, x, y, { width: cols[i].w - 4 });
      h = Math.max(h, doc.y - y);
      x += cols[i].w;
    });
    doc.x = MARGIN;
    doc.y = y + h + 3;
  };
  row(cols.map((col) => col.title), true);
  ranked.forEach((cand, i) => {
    if (doc.y > doc.page.height - 90) doc.addPage();
    const r = cand.result;
    row(
      [String(i + 1), r.name, FAILURE_MODE_LABELS[r.governingMode], r.safetyFactor.toFixed(2), r.targetSafetyFactor.toFixed(2), formatMargin(r.margin), mm(r.requiredThickness), r.massPerArea === null ? '—' : r.massPerArea.toFixed(1)],
      false,
      MODE_COLOURS[r.governingMode],
    );
  });

  heading('Margin by mode against the target');
  const modes = FAILURE_MODES.filter((m) => ranked.some((r) => r.result.modes.some((x) => x.mode === m)));
  const labelW = 150;
  const chartW = width - labelW - 10;
  const scale = (margin: number) => ((Math.max(-1, Math.min(margin, 3)) + 1) / 4) * chartW;
  const zeroX = MARGIN + labelW + scale(0);
  for (const cand of ranked) {
    const needed = modes.length * 7 + 8;
    if (doc.y + needed > doc.page.height - MARGIN) doc.addPage();
    const top = doc.y;
    doc.font('Body').fontSize(7.5).fillColor(INK).text(cand.result.name, MARGIN, top, { width: labelW - 6, height: needed, ellipsis: true });
    modes.forEach((mode, j) => {
      const margin = modeMargin(cand.result, mode);
      if (margin === undefined) return;
      const x0 = Math.min(zeroX, MARGIN + labelW + scale(margin));
      const w = Math.abs(MARGIN + labelW + scale(margin) - zeroX);
      doc.rect(x0, top + j * 7, Math.max(w, 0.5), 5.5).fillColor(MODE_COLOURS[mode]).fill();
    });
    doc.moveTo(zeroX, top - 2).lineTo(zeroX, top + needed - 4).strokeColor(INK).lineWidth(0.8).stroke();
    doc.x = MARGIN;
    doc.y = top + needed;
  }
  doc.font('Body').fontSize(7).fillColor(SOFT).text('margin = safety factor / target − 1; the line marks the target; bars are clipped at −100 % and +300 %', MARGIN, doc.y + 2);
  doc.moveDown(0.3);
  let lx = MARGIN;
  for (const mode of modes) {
    doc.rect(lx, doc.y + 1, 8, 6).fillColor(MODE_COLOURS[mode]).fill();
    doc.fillColor(INK).fontSize(7.5).text(FAILURE_MODE_LABELS[mode], lx + 11, doc.y, { lineBreak: false });
    lx += 80;
  }
  doc.x = MARGIN;
  doc.moveDown(1);

  for (const cand of ranked) {
    const r = cand.result;
    const set = cand.propertySet;
    heading(`${r.name}`);
    pair('Governing mode', `${FAILURE_MODE_LABELS[r.governingMode]} — safety factor ${r.safetyFactor.toFixed(2)} against a target of ${r.targetSafetyFactor}, margin ${formatMargin(r.margin)}`);
    pair('Required thickness', `${mm(r.requiredThickness)}, set by ${sizedByText(r.sizedBy ?? null)}`);
    if (r.rating) {
      const rt = r.rating;
      pair(
        'Rating table',
        rt.requiredThickness === null
          ? `${rt.name}: ${rt.outside ?? 'no number'}`
          : `${rt.name}: minimum ratio ${rt.minimumRatio?.toFixed(3)}, rated ${rt.ratedPressure === null ? 'below the table' : `${rt.ratedPressureIsLowerBound ? 'at least ' : ''}${mpa(rt.ratedPressure)}`} at the entered thickness; analytical cross-check SF ${rt.crossCheckSafetyFactor?.toFixed(2) ?? '—'}`,
      );
      pair('Table source', rt.source);
      doc.font('Body-Italic').fontSize(7.5).fillColor(SOFT).text(rt.interpolation, { indent: 10 });
    }
    if (r.coverage) pair('Human occupancy', r.coverage === 'covered' ? 'covered by a window rule' : 'NOT covered by any window rule in the catalogue');
    if (r.proofSafetyFactor !== undefined) pair('Proof test', `lowest safety factor ${r.proofSafetyFactor.toFixed(2)} at ${mpa(c.proofTestPressure)} against short-term strength`);
    doc.font('Body').fontSize(8.5).fillColor(INK).text(factorsText(r.factors));
    if (cand.note) pair('Why it is on the shortlist', cand.note);
    doc.moveDown(0.3);
    for (const m of r.modes) {
      if (doc.y > doc.page.height - 80) doc.addPage();
      doc.font('Body-Bold').fontSize(8.5).fillColor(MODE_COLOURS[m.mode]).text(`${FAILURE_MODE_LABELS[m.mode]}${m.check ? ` (${m.check})` : ''}: `, { continued: true });
      doc
        .font('Body')
        .fillColor(INK)
        .text(
          `stress ${mpa(m.stress)}, allowable ${mpa(m.allowable)}, safety factor ${m.safetyFactor.toFixed(2)}, needs ${mm(m.requiredThickness)}` +
            (m.proof ? `; at proof ${m.proof.safetyFactor.toFixed(2)}` : '') +
            (m.collapse ? `; pressures: elastic ${mpa(m.collapse.elastic)}, yield ${mpa(m.collapse.yield)}, collapse ${mpa(m.collapse.collapse)}` : ''),
        );
      doc.font('Body-Italic').fontSize(7.5).fillColor(SOFT).text(`Model: ${m.model}`, { indent: 10 });
    }
    if (r.warnings.length) {
      doc.moveDown(0.3).font('Body-Bold').fontSize(8.5).fillColor(colors.verdict.watch).text('Warnings');
      for (const w of r.warnings) doc.font('Body').fontSize(8).fillColor(INK).text(`• ${w}`, { indent: 6 });
    }
    doc.moveDown(0.3);
    pair('Data', `property set ${set.id}, version ${set.version} (${set.status}), ${set.material.name} — ${set.condition}`);
    const ref = set.reference;
    if (ref) {
      // Records frozen before references were versioned cite version 1 and name no document version.
      const versions = [`reference version ${ref.version ?? 1}`, ...(ref.documentVersion ? [`document version ${ref.documentVersion}`] : [])].join(', ');
      pair('Source', `${[ref.authors, ref.year, ref.title, ref.identifier, ref.location].filter(Boolean).join('; ')} (${versions})`);
    }
    const inputs = describeInputs(set);
    pair('Inputs', `${inputs.filter((v) => v.status === 'confirmed').length} of ${inputs.length} confirmed against their source`);
    for (const v of inputs) doc.font('Body').fontSize(8).fillColor(v.status === 'confirmed' ? INK : colors.verdict.watch).text(`• ${v.label}: ${VALUE_STATUS_LABELS[v.status]}${v.detail ? ` — ${v.detail}` : ''}`, { indent: 6 });
  }

  heading('Models used');
  for (const model of c.engine.models) doc.font('Body').fontSize(8).fillColor(INK).text(`• ${model}`);

  // Page footers
  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    doc.font('Body').fontSize(7).fillColor(SOFT).text(
      `Isobath design record ${recordId} · ${c.project.name} · page ${i + 1} of ${range.count} · screening estimate; see cautions`,
      MARGIN,
      doc.page.height - MARGIN + 16,
      { width, align: 'center', lineBreak: false },
    );
  }
  doc.end();
  return done;
}
