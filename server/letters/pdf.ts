/**
 * Renders a recommendation letter as a PDF: letterhead, decision up front, the data
 * and plan, the rerun's results in APA style, the checklist, the scope caution,
 * signatures and the verification panel, with the code in every page's footer.
 */
import QRCode from 'qrcode';
import type { LetterInput } from './letter-input';
import { CONDITION_HEADINGS, CRITERION_LABELS, DECISION_HEADLINES, DECISION_SENTENCES, DESIGN_LABELS, VERDICT_LABELS, longDate, longDateTime } from './labels';
import { createDoc, LetterWriter, PAGE, type Doc } from './pdf-layout';
import { COLOURS, DECISION_COLOURS, VERDICT_COLOURS } from './pdf-theme';
import { bounded, letterResults } from './result-lines';

/** Prefix of the verification code in the PDF's Keywords, read back by the verifier. */
export const CODE_KEYWORD_PREFIX = 'assayer-verification-code:';
/** Custom document-information key that also carries the code. */
export const CODE_INFO_KEY = 'AssayerVerificationCode';

/** The scope caution every letter carries. */
export const SCOPE_CAUTION =
  'This review covers statistical method only. It is not ethics-board approval, legal, clinical or policy advice; ' +
  "the institution's review board, data-protection rules and local regulations prevail.";

/** Builds the letter on an open pdfkit document (not yet ended) so a signer can add its placeholder. */
export async function buildLetterDocument(input: LetterInput): Promise<Doc> {
  const info: Record<string, string | Date> = {
    Title: `Recommendation on statistical method: ${input.request.title}`,
    Author: input.letterhead.officeName,
    Subject: `Request ${input.request.reference}, letter version ${input.version}`,
    Keywords: `${CODE_KEYWORD_PREFIX}${input.verification.code} request:${input.request.reference} version:${input.version}`,
    Creator: 'Assayer',
    Producer: 'Assayer letter engine',
    CreationDate: new Date(input.dates.signed),
    [CODE_INFO_KEY]: input.verification.code,
  };
  const doc = createDoc(info);
  const w = new LetterWriter(doc);
  const qr = await QRCode.toBuffer(input.verification.url, { type: 'png', errorCorrectionLevel: 'M', margin: 0, width: 360, color: { dark: COLOURS.ink, light: '#ffffff' } });

  letterhead(w, input);
  titleBlock(w, input);
  decisionPanel(w, input);
  requestAndData(w, input);
  planSection(w, input);
  resultsSection(w, input);
  checklistSection(w, input);
  scopeSection(w);
  signatureSection(w, input);
  verificationPanel(w, input, qr);
  pageFurniture(doc, input);
  return doc;
}

/** Ends a document and collects its bytes. */
export function finishDocument(doc: Doc): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
    doc.end();
  });
}

/** Renders an unsigned letter (previews, tests). Signed letters come from signLetter. */
export async function renderLetterPdf(input: LetterInput): Promise<Buffer> {
  return finishDocument(await buildLetterDocument(input));
}

function letterhead(w: LetterWriter, input: LetterInput): void {
  const { doc } = w;
  const lh = input.letterhead;
  const top = 40;
  const mark = 38;
  doc.roundedRect(w.left, top, mark, mark, 5).fillColor(COLOURS.accent).fill();
  const logo = lh.logoText.slice(0, 4);
  w.use('display', logo.length > 2 ? 11 : 15, COLOURS.white);
  const logoH = doc.heightOfString(logo, { width: mark });
  doc.text(logo, w.left, top + (mark - logoH) / 2 + 1, { width: mark, align: 'center' });

  const textX = w.left + mark + 12;
  const rightW = 170;
  const nameW = w.width - mark - 12 - rightW - 10;
  w.use('display', 14, COLOURS.ink).text(lh.officeName, textX, top + 1, { width: nameW });
  w.use('body', 9, COLOURS.muted).text(lh.unit, textX, doc.y + 1, { width: nameW });
  const leftBottom = doc.y;

  const contact = [...lh.addressLines, ...lh.contactLines].join('\n');
  w.use('body', 7.5, COLOURS.muted).text(contact, w.left + w.width - rightW, top + 1, { width: rightW, align: 'right', lineGap: 1 });
  const y = Math.max(leftBottom, doc.y, top + mark) + 10;
  doc.moveTo(w.left, y).lineTo(w.left + w.width, y).lineWidth(1.2).strokeColor(COLOURS.accent).stroke();
  doc.y = y + 16;
}

function titleBlock(w: LetterWriter, input: LetterInput): void {
  const { doc } = w;
  w.use('bold', 7.5, COLOURS.accent).text('RECOMMENDATION ON STATISTICAL METHOD', w.left, doc.y, { width: w.width, characterSpacing: 1.2 });
  doc.y += 3;
  w.use('bold', 16, COLOURS.ink).text(input.request.title, w.left, doc.y, { width: w.width, lineGap: 1 });
  doc.y += 3;
  const version = `Request ${input.request.reference} · Letter version ${input.version}` + (input.supersedes ? ` · replaces the letter with code ${input.supersedes}` : '');
  w.use('body', 9, COLOURS.muted).text(version, w.left, doc.y, { width: w.width });
  doc.y += 10;

  const people: [string, string, string?][] = [
    ['Submitted by', input.submitter.name, input.submitter.email],
    ['Reviewed by', input.reviewer.name, input.reviewer.email],
  ];
  if (input.countersigner) people.push(['Countersigned by', input.countersigner.name, input.countersigner.email]);
  const dates: [string, string, string?][] = [
    ['Filed', longDate(input.dates.filed)],
    ['Decided', longDate(input.dates.decided)],
    ['Signed', longDateTime(input.dates.signed)],
  ];
  const perRow = 3;
  const cellW = w.width / perRow;
  for (const row of [people, dates]) {
    const y = doc.y;
    let rowH = 0;
    row.forEach(([label, value, email], j) => {
      const x = w.left + j * cellW;
      w.use('bold', 7, COLOURS.faint).text(label.toUpperCase(), x, y, { width: cellW - 10, characterSpacing: 0.6 });
      w.use('body', 9, COLOURS.ink).text(value, x, doc.y + 1.5, { width: cellW - 10, lineGap: 1 });
      if (email) w.use('condensed', 8, COLOURS.muted).text(email, x, doc.y + 0.5, { width: cellW - 6, lineGap: 1 });
      rowH = Math.max(rowH, doc.y - y);
    });
    doc.y = y + rowH + 7;
  }
}

function decisionPanel(w: LetterWriter, input: LetterInput): void {
  const { doc } = w;
  const colours = DECISION_COLOURS[input.decision];
  const padX = 16;
  const innerW = w.width - padX * 2 - 4;
  const headline = DECISION_HEADLINES[input.decision];
  const sentence = DECISION_SENTENCES[input.decision];
  const listHeading = CONDITION_HEADINGS[input.decision];
  const items = input.conditions.map((c, i) => `${i + 1}.  ${c}`);

  const panelHeight = (withList: boolean): number => {
    let h = 12;
    h += w.measure('DECISION', 'bold', 7, innerW) + 2;
    h += w.measure(headline, 'bold', 15, innerW) + 3;
    h += w.measure(sentence, 'body', 9.5, innerW) + 4;
    if (input.summary) h += w.measure(input.summary, 'body', 9.5, innerW) + 5;
    if (withList && items.length) {
      h += w.measure(listHeading, 'bold', 8.5, innerW) + 3;
      for (const it of items) h += w.measure(it, 'body', 9, innerW - 8) + 2.5;
    }
    return h + 10;
  };
  // A long list of conditions would not fit in one tinted panel: it then follows the panel as a normal list.
  const inside = panelHeight(true) < (w.bottom - PAGE.margins.top) * 0.5;
  const h = panelHeight(inside);

  w.ensureSpace(h);
  doc.y += 4;
  const y0 = doc.y;
  doc.rect(w.left, y0, w.width, h).fillColor(colours.tint).fill();
  doc.rect(w.left, y0, 4, h).fillColor(colours.bar).fill();
  const x = w.left + 4 + padX;
  doc.y = y0 + 12;
  w.use('bold', 7, colours.bar).text('DECISION', x, doc.y, { width: innerW, characterSpacing: 1 });
  doc.y += 2;
  w.use('bold', 15, colours.bar).text(headline, x, doc.y, { width: innerW });
  doc.y += 3;
  w.use('body', 9.5, COLOURS.ink).text(sentence, x, doc.y, { width: innerW, lineGap: 1.5 });
  doc.y += 4;
  if (input.summary) {
    w.use('body', 9.5, COLOURS.ink).text(input.summary, x, doc.y, { width: innerW, lineGap: 1.5 });
    doc.y += 5;
  }
  if (inside && items.length) {
    w.use('bold', 8.5, COLOURS.ink).text(listHeading, x, doc.y, { width: innerW, lineGap: 1.5 });
    doc.y += 3;
    for (const it of items) {
      w.use('body', 9, COLOURS.ink).text(it, x + 8, doc.y, { width: innerW - 8, lineGap: 1.5 });
      doc.y += 2.5;
    }
  }
  doc.y = y0 + h + 2;
  doc.x = w.left;
  if (!inside && items.length) {
    w.subheading(listHeading);
    w.list(input.conditions, { numbered: true });
  }
}

function requestAndData(w: LetterWriter, input: LetterInput): void {
  w.heading('1  The request and its data');
  if (input.request.purpose) w.paragraph(input.request.purpose, { gapAfter: 6 });
  w.definitions([
    { label: 'Data file', value: input.dataset.filename },
    { label: 'Rows', value: input.dataset.rows.toLocaleString('en-GB') },
    { label: 'SHA-256 of the file', value: input.dataset.sha256, font: 'mono', size: 8 },
  ]);
}

function planSection(w: LetterWriter, input: LetterInput): void {
  const p = input.plan;
  w.heading('2  The analysis plan');
  const rows = [
    { label: 'Design', value: DESIGN_LABELS[p.designKind] },
    { label: 'Outcome', value: p.outcome },
    ...p.factors.map((f) => ({ label: f.kind === 'within' ? 'Within-subjects factor' : 'Between-subjects factor', value: `${f.name}: ${f.levels.join(', ')}` })),
  ];
  if (p.subject) rows.push({ label: 'Subject identifier', value: p.subject });
  rows.push({ label: 'Significance level', value: `α = ${bounded(p.alpha, 3).replace(/0+$/, '')}` });
  rows.push({ label: 'Planned comparisons', value: p.comparisons.length ? p.comparisons.join('\n') : 'None planned' });
  w.definitions(rows);
}

function resultsSection(w: LetterWriter, input: LetterInput): void {
  const { doc } = w;
  const r = letterResults(input.rerun.result);
  w.heading('3  Results of the office\'s rerun');
  const sameData = input.rerun.dataHash === input.dataset.sha256;
  w.paragraph(
    `The office reran the analysis on its own server (rerun ${input.rerun.rerunId}, Assayer engine ${input.rerun.engineVersion}). ` +
      (sameData ? 'The rerun read exactly the data file above (same SHA-256). ' : `Note: the rerun read data with SHA-256 ${input.rerun.dataHash}, which differs from the file above. `) +
      r.sampleLine,
    { gapAfter: 4 },
  );

  w.subheading('Main tests');
  for (const line of r.mainTests) resultLine(w, line.label, line.text);
  if (r.fit) resultLine(w, 'Model fit', r.fit);
  if (r.coefficients.length) {
    w.subheading('Coefficients');
    for (const line of r.coefficients) resultLine(w, line.label, line.text);
  }

  if (r.descriptives.length) {
    w.subheading('Cell means', 60);
    w.table(
      [
        { heading: 'Cell', width: 4 },
        { heading: 'n', width: 1, align: 'right' },
        { heading: 'Mean', width: 1.4, align: 'right' },
        { heading: 'SD', width: 1.4, align: 'right' },
        { heading: r.ciLabel + ' of the mean', width: 2.6, align: 'right' },
      ],
      r.descriptives.map((d) => [{ text: d.cell }, { text: d.n }, { text: d.mean }, { text: d.sd }, { text: d.interval }]),
    );
  }

  if (r.assumptions.length) {
    w.subheading('Assumption checks');
    w.definitions(r.assumptions.map((a) => ({ label: a.label, value: a.text })), 170);
  }
  if (r.corrections.length) {
    w.subheading('Corrections and robust alternatives');
    w.list(r.corrections);
  }
  if (r.comparisons.length) {
    const factors = [...new Set(r.comparisons.map((c) => c.factor))];
    for (const f of factors) {
      const rows = r.comparisons.filter((c) => c.factor === f);
      w.subheading(`Pairwise comparisons: ${f} (${rows[0].method})`, 60);
      w.table(
        [
          { heading: 'Pair', width: 3.4 },
          { heading: 'Difference', width: 1.4, align: 'right' },
          { heading: r.ciLabel + ' (adjusted)', width: 2.2, align: 'right' },
          { heading: 'Test', width: 1.9, align: 'right' },
          { heading: 'Adjusted p', width: 1.6, align: 'right' },
        ],
        rows.map((c) => [{ text: c.pair }, { text: c.difference }, { text: c.interval }, { text: c.statistic }, { text: c.pAdjusted.replace(/^p adj = /, '').replace(/^p adj /, '') }]),
      );
    }
  }
  if (r.nonparametric.length) {
    w.subheading('Rank-based alternatives');
    for (const line of r.nonparametric) resultLine(w, line.label, line.text);
  }
  if (r.warnings.length) {
    w.subheading('Engine notes');
    w.list(r.warnings, { size: 8.5 });
  }
  doc.x = w.left;
}

/** A result: the term in small bold, the reporting string beneath it. */
function resultLine(w: LetterWriter, label: string, text: string): void {
  const { doc } = w;
  const h = w.measure(label, 'bold', 8.5, w.width - 12) + w.measure(text, 'body', 9.5, w.width - 12) + 6;
  w.ensureSpace(h);
  w.use('bold', 8.5, COLOURS.muted).text(label, w.left + 12, doc.y, { width: w.width - 12 });
  doc.y += 1;
  w.use('body', 9.5, COLOURS.ink).text(text, w.left + 12, doc.y, { width: w.width - 12, lineGap: 1.5 });
  doc.y += 5;
}

function checklistSection(w: LetterWriter, input: LetterInput): void {
  w.heading('4  Checklist', 80);
  if (input.checklist.length === 0) {
    w.paragraph('No checklist entries were recorded.');
    return;
  }
  w.table(
    [
      { heading: 'Criterion', width: 2.6, font: 'condensedBold' },
      { heading: 'Verdict', width: 1.4 },
      { heading: "Reviewer's note (and the rerun's automatic finding)", width: 6.4, font: 'condensed' },
    ],
    input.checklist.map((e) => [
      { text: CRITERION_LABELS[e.criterion] },
      { text: VERDICT_LABELS[e.verdict], colour: VERDICT_COLOURS[e.verdict], font: 'condensedBold' },
      { text: e.reviewerNote || '—', note: e.automaticFinding ? `Automatic finding: ${e.automaticFinding}` : null },
    ]),
    { size: 8.5 },
  );
}

function scopeSection(w: LetterWriter): void {
  w.heading('5  Scope of this review', 40);
  w.paragraph(SCOPE_CAUTION);
}

function signatureSection(w: LetterWriter, input: LetterInput): void {
  const { doc } = w;
  const signers = [{ who: input.reviewer, role: input.reviewer.role ?? 'Methods reviewer' }];
  if (input.countersigner) signers.push({ who: input.countersigner, role: input.countersigner.role ?? 'Head of office' });
  w.ensureSpace(78);
  doc.y += 12;
  const y = doc.y;
  const colW = w.width / 2;
  let lowest = y + 40;
  signers.forEach((s, i) => {
    const x = w.left + i * colW;
    w.use('display', 11, COLOURS.ink).text(s.who.name, x, y, { width: colW - 16 });
    w.use('body', 8.5, COLOURS.muted).text(s.role, x, doc.y + 1, { width: colW - 16 });
    w.use('body', 8.5, COLOURS.muted).text(input.letterhead.officeName, x, doc.y + 0.5, { width: colW - 16 });
    w.use('body', 8.5, COLOURS.muted).text(`Signed electronically, ${longDate(input.dates.signed)}`, x, doc.y + 1, { width: colW - 16 });
    lowest = Math.max(lowest, doc.y);
  });
  doc.y = lowest + 8;
  w.paragraph('This file carries the digital signature of the office. Any change to it after signing breaks the signature, and the verification page will report it as altered.', { size: 8, colour: COLOURS.muted });
}

function verificationPanel(w: LetterWriter, input: LetterInput, qr: Buffer): void {
  const { doc } = w;
  const qrSize = 78;
  const h = qrSize + 24;
  w.ensureSpace(h + 10);
  doc.y += 6;
  const y = doc.y;
  doc.rect(w.left, y, w.width, h).lineWidth(0.8).strokeColor(COLOURS.rule).stroke();
  doc.image(qr, w.left + 12, y + 12, { width: qrSize, height: qrSize });
  const x = w.left + qrSize + 28;
  const tw = w.width - qrSize - 40;
  w.use('bold', 10, COLOURS.accent).text('Check that this letter is authentic and current', x, y + 13, { width: tw });
  w.use('body', 8.5, COLOURS.ink).text('Anyone may check this letter, without signing in: scan the code, or open the address below and enter the verification code or upload this PDF.', x, doc.y + 3, { width: tw, lineGap: 1 });
  w.use('body', 8.5, COLOURS.accent).text(input.verification.url, x, doc.y + 4, { width: tw, link: input.verification.url, underline: false });
  w.use('bold', 7, COLOURS.faint).text('VERIFICATION CODE', x, doc.y + 6, { width: tw, characterSpacing: 0.8 });
  w.use('mono', 13, COLOURS.ink).text(input.verification.code, x, doc.y + 1, { width: tw, characterSpacing: 1 });
  doc.y = y + h + 4;
  doc.x = w.left;
}

/** Running header on continuation pages and the footer with code and page numbers on every page. */
function pageFurniture(doc: Doc, input: LetterInput): void {
  const range = doc.bufferedPageRange();
  const total = range.count;
  for (let i = range.start; i < range.start + total; i++) {
    doc.switchToPage(i);
    const { left, right } = doc.page.margins;
    const width = doc.page.width - left - right;
    // Writing below the bottom margin would make pdfkit open a new page.
    const savedBottom = doc.page.margins.bottom;
    doc.page.margins.bottom = 0;
    if (i > range.start) {
      doc.font('body').fontSize(7.5).fillColor(COLOURS.faint)
        .text(`${input.letterhead.officeName} · Recommendation on request ${input.request.reference}, letter version ${input.version}`, left, 34, { width, lineBreak: false });
    }
    const fy = doc.page.height - 44;
    doc.moveTo(left, fy - 6).lineTo(left + width, fy - 6).lineWidth(0.5).strokeColor(COLOURS.rule).stroke();
    doc.font('body').fontSize(7.5).fillColor(COLOURS.muted)
      .text(`Verification code ${input.verification.code} · ${input.verification.url}`, left, fy, { width: width - 80, lineBreak: false, ellipsis: true });
    doc.font('body').fontSize(7.5).fillColor(COLOURS.muted).text(`Page ${i - range.start + 1} of ${total}`, left + width - 80, fy, { width: 80, align: 'right', lineBreak: false });
    doc.page.margins.bottom = savedBottom;
  }
}
