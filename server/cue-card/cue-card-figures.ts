/**
 * The cue card's two small figures drawn with pdfkit: a step's stick-figure pictogram (its two
 * extreme poses, the first in grey) and the verified attitude over time with the target dashed.
 */
import type PDFDocument from 'pdfkit';

import type { CueCardContent } from './cue-card-content.ts';
import type { StepPictogram } from './step-pictograms.ts';

type Doc = InstanceType<typeof PDFDocument>;

/** Print colours of the figures: the ink of the card, a grey for the first pose, and one hue per attitude axis. */
const FIGURE = { ink: '#1B1F24', ghost: '#A7B0BB', muted: '#5B6470', line: '#D5DAE1', yaw: '#C77700', pitch: '#1F8A80', roll: '#4A5FC1' };

/** Draws a pictogram fitted into the box (x, y, w, h), keeping the body's proportions, with its view named underneath. */
export function drawPictogram(doc: Doc, pic: StepPictogram, x: number, y: number, w: number, h: number): void {
  const labelH = 8;
  const lines = pic.poses.flat();
  if (!lines.length) return;
  let minX = Infinity, maxX = -Infinity, minY = Infinity, maxY = -Infinity;
  for (const [x1, y1, x2, y2] of lines) {
    minX = Math.min(minX, x1, x2); maxX = Math.max(maxX, x1, x2);
    minY = Math.min(minY, y1, y2); maxY = Math.max(maxY, y1, y2);
  }
  for (const head of pic.heads) {
    if (!head) continue;
    const [cx, cy, r] = head;
    minX = Math.min(minX, cx - r); maxX = Math.max(maxX, cx + r);
    minY = Math.min(minY, cy - r); maxY = Math.max(maxY, cy + r);
  }
  const scale = Math.min(w / Math.max(maxX - minX, 1e-6), (h - labelH) / Math.max(maxY - minY, 1e-6));
  const ox = x + (w - (maxX - minX) * scale) / 2;
  const oy = y + (h - labelH + (maxY - minY) * scale) / 2;
  const px = (v: number) => ox + (v - minX) * scale;
  const py = (v: number) => oy - (v - minY) * scale;
  pic.poses.forEach((pose, i) => {
    const last = i === pic.poses.length - 1;
    doc.save().lineWidth(last ? 1.1 : 0.9).lineCap('round').strokeColor(last ? FIGURE.ink : FIGURE.ghost);
    for (const [x1, y1, x2, y2] of pose) doc.moveTo(px(x1), py(y1)).lineTo(px(x2), py(y2));
    doc.stroke().restore();
    const head = pic.heads[i];
    if (head) doc.save().circle(px(head[0]), py(head[1]), head[2] * scale).lineWidth(last ? 1.1 : 0.9).strokeColor(last ? FIGURE.ink : FIGURE.ghost).stroke().restore();
  });
  doc.font('regular').fontSize(6).fillColor(FIGURE.muted).text(pic.view, x, y + h - labelH + 1, { width: w, align: 'center', lineBreak: false });
}

/** Draws the attitude plot into the box (x, y, w, h): unwrapped yaw, pitch and roll against time, targets dashed, with a legend. */
export function drawAttitudePlot(doc: Doc, att: NonNullable<CueCardContent['attitude']>, x: number, y: number, w: number, h: number): void {
  const axisW = 28;
  const legendH = 12;
  const plot = { x: x + axisW, y: y + legendH, w: w - axisW, h: h - legendH - 12 };
  const series = [
    { key: 'yaw' as const, values: att.yaw, color: FIGURE.yaw },
    { key: 'pitch' as const, values: att.pitch, color: FIGURE.pitch },
    { key: 'roll' as const, values: att.roll, color: FIGURE.roll },
  ];
  let lo = Math.min(0, att.target.yaw, att.target.pitch, att.target.roll);
  let hi = Math.max(0, att.target.yaw, att.target.pitch, att.target.roll);
  for (const s of series) for (const v of s.values) { lo = Math.min(lo, v); hi = Math.max(hi, v); }
  const pad = Math.max((hi - lo) * 0.08, 2);
  lo -= pad; hi += pad;
  const t0 = att.t[0] ?? 0;
  const t1 = Math.max(att.t[att.t.length - 1] ?? 1, t0 + 1e-6);
  const sx = (t: number) => plot.x + ((t - t0) / (t1 - t0)) * plot.w;
  const sy = (v: number) => plot.y + plot.h - ((v - lo) / (hi - lo)) * plot.h;

  // Frame, zero line and the value and time ends.
  doc.save().rect(plot.x, plot.y, plot.w, plot.h).lineWidth(0.5).strokeColor(FIGURE.line).stroke().restore();
  if (lo < 0 && hi > 0) doc.save().moveTo(plot.x, sy(0)).lineTo(plot.x + plot.w, sy(0)).lineWidth(0.5).strokeColor(FIGURE.line).stroke().restore();
  doc.font('regular').fontSize(6.5).fillColor(FIGURE.muted);
  doc.text(`${Math.round(hi)}°`, x, plot.y - 3, { width: axisW - 4, align: 'right', lineBreak: false });
  doc.text(`${Math.round(lo)}°`, x, plot.y + plot.h - 5, { width: axisW - 4, align: 'right', lineBreak: false });
  doc.text('0 s', plot.x, plot.y + plot.h + 2, { lineBreak: false });
  doc.text(`${Number(t1.toFixed(1))} s`, plot.x + plot.w - 40, plot.y + plot.h + 2, { width: 40, align: 'right', lineBreak: false });

  for (const s of series) {
    const target = att.target[s.key];
    doc.save().moveTo(plot.x, sy(target)).lineTo(plot.x + plot.w, sy(target)).dash(3, { space: 2 }).lineWidth(0.6).strokeColor(s.color).stroke().undash().restore();
    if (!s.values.length) continue;
    doc.save().lineWidth(1).lineJoin('round').strokeColor(s.color);
    doc.moveTo(sx(att.t[0]), sy(s.values[0]));
    for (let k = 1; k < s.values.length; k++) doc.lineTo(sx(att.t[k]), sy(s.values[k]));
    doc.stroke().restore();
  }

  // Legend: one swatch per axis, then what the dashes mean.
  let lx = plot.x;
  for (const s of series) {
    doc.save().moveTo(lx, y + 4).lineTo(lx + 12, y + 4).lineWidth(1.4).strokeColor(s.color).stroke().restore();
    doc.font('regular').fontSize(7).fillColor(FIGURE.ink).text(s.key, lx + 15, y, { lineBreak: false });
    lx += 52;
  }
  doc.font('regular').fontSize(7).fillColor(FIGURE.muted).text('dashed: target', lx, y, { lineBreak: false });
}
