/**
 * Renders a cue card to PDF with pdfkit: A4 portrait, one page for the usual few steps (more steps
 * continue on further pages with the step table's header repeated). Black on white for print, a
 * thin amber rule as the product's accent, a tick box per step for the trainee's pen, a stick-figure
 * pictogram per step and a small plot of the verified attitude.
 */
import PDFDocument from 'pdfkit';

import type { CueCardContent } from './cue-card-content.ts';
import { drawAttitudePlot, drawPictogram } from './cue-card-figures.ts';
import { cueCardFonts } from './cue-card-fonts.ts';

/** Options of {@link renderCueCard}. */
export interface RenderCueCardOptions {
  /** Flate-compress page streams (default true; false leaves them readable for debugging). */
  compress?: boolean;
  /** Print time shown in the footer (default now). */
  printedAt?: Date;
}

const INK = '#1B1F24';
const MUTED = '#5B6470';
const LINE = '#D5DAE1';
const ACCENT = '#FFB454';
/** Print red for a robustness caution (readable on white, kept apart from the amber rule). */
const DANGER = '#B3261E';
const MARGIN = 48;

/** "2025-03-04 09:15 UTC" from an ISO time (the card is read away from any screen's time zone). */
function utc(iso: string | Date): string {
  const d = typeof iso === 'string' ? new Date(iso) : iso;
  return Number.isNaN(d.getTime()) ? String(iso) : `${d.toISOString().slice(0, 16).replace('T', ' ')} UTC`;
}

const secs = (s: number) => `${Number(s.toFixed(1))} s`;

/** The PDF bytes of one cue card. */
export function renderCueCard(card: CueCardContent, opts: RenderCueCardOptions = {}): Promise<Buffer> {
  const fonts = cueCardFonts();
  const doc = new PDFDocument({
    size: 'A4', margin: MARGIN, compress: opts.compress ?? true,
    info: { Title: `${card.sequenceName} v${card.version} cue card`, Author: 'holonaut', Subject: 'Cue card', Creator: 'holonaut' },
  });
  doc.registerFont('regular', fonts.regular);
  doc.registerFont('semibold', fonts.semibold);
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });

  const left = MARGIN;
  const width = doc.page.width - 2 * MARGIN;
  const bottom = () => doc.page.height - MARGIN;
  const rule = (y: number, color = LINE, w = 0.6) => doc.save().moveTo(left, y).lineTo(left + width, y).lineWidth(w).strokeColor(color).stroke().restore();

  // Masthead: mark on the left, title on the right, an amber rule under both.
  doc.font('semibold').fontSize(12).fillColor(INK).text(card.productMark, left, MARGIN, { lineBreak: false, characterSpacing: 0.6 });
  doc.font('regular').fontSize(10).fillColor(MUTED).text(card.title.toUpperCase(), left, MARGIN + 2, { width, align: 'right', characterSpacing: 1.2 });
  rule(MARGIN + 20, ACCENT, 1.5);

  // Sequence and clearance.
  let y = MARGIN + 34;
  doc.font('semibold').fontSize(20).fillColor(INK).text(card.sequenceName, left, y, { width });
  y = doc.y + 2;
  const cleared = [card.statusLabel, card.clearedByName ? `by ${card.clearedByName}` : null, card.clearedAt ? `on ${utc(card.clearedAt)}` : null].filter(Boolean).join(' ');
  doc.font('regular').fontSize(10.5).fillColor(MUTED).text(`Version ${card.version}  ·  ${cleared}`, left, y, { width });
  y = doc.y + 12;

  // Facts in two columns of label/value pairs.
  const facts: [string, string][] = [
    ['Crew member', card.callSign ? `${card.crewMemberName}  ·  call sign ${card.callSign}` : card.crewMemberName],
    ['Profile version', `v${card.profileVersion}`],
    ['Engine', card.engineVersionShort ?? '—'],
    ['Inputs hash', card.inputsHashShort ?? '—'],
  ];
  const colW = width / 2;
  facts.forEach(([label, value], i) => {
    const x = left + (i % 2) * colW;
    const rowY = y + Math.floor(i / 2) * 30;
    doc.font('regular').fontSize(7.5).fillColor(MUTED).text(label.toUpperCase(), x, rowY, { width: colW - 12, characterSpacing: 0.8 });
    doc.font('semibold').fontSize(10).fillColor(INK).text(value, x, rowY + 10, { width: colW - 12, lineBreak: false, ellipsis: true });
  });
  y += Math.ceil(facts.length / 2) * 30 + 6;
  rule(y);
  y += 10;

  // Target, what the verified run reaches, and the peak joint rate.
  const line = (label: string, value: string) => {
    doc.font('semibold').fontSize(10).fillColor(INK).text(`${label}  `, left, y, { continued: true });
    doc.font('regular').fillColor(INK).text(value, { width });
    y = doc.y + 4;
  };
  line('Target', `${card.targetText} (±${Number(card.toleranceDeg.toFixed(1))}°)`);
  if (card.reached) {
    const r = card.reached;
    line('Verified run', `reaches ${r.attitudeText}; ${Number(r.errorDeg.toFixed(2))}° from the target (${r.withinTolerance ? 'within' : 'outside'} tolerance) in ${secs(r.durationS)}`);
  } else {
    line('Verified run', 'no verification report on file');
  }
  if (card.engineNote) line('Engine', card.engineNote);
  if (card.peakJointRate) {
    const p = card.peakJointRate;
    line('Peak joint rate', `${Math.round(p.maxDegS)}°/s${p.dofLabel ? ` (${p.dofLabel})` : ''} against a limit of ${Math.round(p.limitDegS)}°/s: ${p.withinLimit ? 'within' : 'above'} the limit`);
  }
  // Robustness: the level's sentence, boxed and tinted when it is a caution, then the figures.
  const rb = card.robustness;
  const caution = rb.level !== 'robust';
  doc.font('semibold').fontSize(10);
  const sentH = doc.heightOfString(rb.sentence, { width: width - 14 });
  doc.font('regular').fontSize(9);
  const figH = rb.figures ? doc.heightOfString(rb.figures, { width: width - 14 }) + 3 : 0;
  y += 4;
  doc.save().rect(left, y - 2, 2.5, sentH + figH + 4).fill(caution ? DANGER : LINE).restore();
  doc.font('semibold').fontSize(10).fillColor(caution ? DANGER : INK).text(rb.sentence, left + 12, y, { width: width - 14 });
  y = doc.y + 3;
  if (rb.figures) {
    doc.font('regular').fontSize(9).fillColor(MUTED).text(rb.figures, left + 12, y, { width: width - 14 });
    y = doc.y;
  }
  y += 12;

  // Step table: tick box, number, time, pictogram (when drawn), cue.
  const PIC = 46;
  const pics = card.pictograms;
  const col = { box: left, num: left + 22, time: left + 46, pic: left + 118, cue: left + (pics ? 124 + PIC + 8 : 124) };
  const cueW = left + width - col.cue;
  const tableHeader = () => {
    doc.font('regular').fontSize(7.5).fillColor(MUTED);
    doc.text('STEP', col.num, y, { lineBreak: false });
    doc.text('FROM – TO', col.time, y, { lineBreak: false });
    if (pics) doc.text('POSE', col.pic, y, { width: PIC, align: 'center', lineBreak: false });
    doc.text('CUE', col.cue, y, { lineBreak: false });
    y += 12;
    rule(y, INK, 0.8);
    y += 6;
  };
  doc.font('semibold').fontSize(12).fillColor(INK).text(`Steps (${card.steps.length}, ${secs(card.steps.reduce((t, s) => t + s.durationS, 0))})`, left, y);
  y = doc.y + 6;
  tableHeader();
  for (const s of card.steps) {
    doc.font('regular').fontSize(9);
    const leadH = s.leadIn ? doc.heightOfString(s.leadIn, { width: cueW }) + 2 : 0;
    doc.font('regular').fontSize(10.5);
    const h = Math.max(doc.heightOfString(s.cue, { width: cueW }) + leadH, pics ? PIC : 14) + 10;
    if (y + h > bottom() - 20) {
      doc.addPage();
      y = MARGIN;
      tableHeader();
    }
    doc.save().rect(col.box, y, 11, 11).lineWidth(0.9).strokeColor(INK).stroke().restore();
    doc.font('semibold').fontSize(10.5).fillColor(INK).text(String(s.number), col.num, y, { lineBreak: false });
    doc.font('regular').fontSize(9).fillColor(MUTED).text(`${Number(s.startS.toFixed(1))} – ${secs(s.startS + s.durationS)}`, col.time, y + 1, { width: (pics ? col.pic : col.cue) - col.time - 6, lineBreak: false });
    const pic = pics?.[s.number - 1];
    if (pic) drawPictogram(doc, pic, col.pic, y - 2, PIC, PIC);
    if (s.leadIn) doc.font('regular').fontSize(9).fillColor(MUTED).text(s.leadIn, col.cue, y + 1, { width: cueW });
    doc.font('regular').fontSize(10.5).fillColor(INK).text(s.cue, col.cue, y + leadH, { width: cueW });
    y += h;
    rule(y - 5);
  }
  y += 8;

  // The verified attitude over time, kept on one page.
  if (card.attitude) {
    const plotH = 120;
    if (y + plotH + 24 > bottom() - 20) {
      doc.addPage();
      y = MARGIN;
    }
    doc.font('semibold').fontSize(12).fillColor(INK).text('Attitude during the verified run', left, y);
    y = doc.y + 6;
    drawAttitudePlot(doc, card.attitude, left, y, width, plotH);
    y += plotH + 14;
  }

  // Cautions, kept together on one page, with an amber bar beside them.
  doc.font('regular').fontSize(8.5);
  const cautionH = card.cautions.reduce((t, c) => t + doc.heightOfString(c, { width: width - 14 }) + 3, 0) + 18;
  if (y + cautionH > bottom() - 20) {
    doc.addPage();
    y = MARGIN;
  }
  doc.save().rect(left, y, 2.5, cautionH - 4).fill(ACCENT).restore();
  doc.font('semibold').fontSize(9).fillColor(INK).text('Cautions', left + 12, y);
  y = doc.y + 3;
  for (const c of card.cautions) {
    doc.font('regular').fontSize(8.5).fillColor(INK).text(c, left + 12, y, { width: width - 14 });
    y = doc.y + 3;
  }

  // Footer on the last page.
  const footY = bottom() - 10;
  doc.font('regular').fontSize(7.5).fillColor(MUTED)
    .text(`Printed ${utc(opts.printedAt ?? new Date())}  ·  ${card.fileName}`, left, footY, { width, align: 'center', lineBreak: false });
  doc.end();
  return done;
}
