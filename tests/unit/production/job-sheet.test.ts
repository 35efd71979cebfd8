import sharp from 'sharp';
import { describe, expect, it } from 'vitest';
import { jobSheetPdf, type JobSheet } from '#server/features/production/job-sheet.ts';
import { pdfPages, pdfText } from '../../support/pdf.ts';

const preview = await sharp({ create: { width: 300, height: 375, channels: 3, background: '#ffffff' } })
  .png()
  .toBuffer();

const sheet = (notes: string, paper: JobSheet['paper']): JobSheet => ({
  studioName: 'Harbour Light Engraving',
  title: 'Order 48: item 1 of 2',
  subtitle: 'Batch 3 · Black-backed glass portrait, 8 × 10 in',
  orderUrl: 'http://127.0.0.1:3000/studio/harbour-light/orders/1',
  preview,
  rows: [
    ['Order', null],
    ['Buyer', 'Rosalind Achterberg'],
    ['Delivery', 'Ship: Tracked post, 3–5 working days'],
    ['Quantity', '1'],
    ['Piece', null],
    ['Blank', 'Black-backed glass portrait'],
    ['Material', 'Black-backed (painted) glass'],
    ['Size', '8 × 10 in'],
    ['Engraving area', '190.5 × 241.3 mm (7.50 × 9.50 in), portrait'],
    ['Inscription', '“For Nan, with love / summer 2026”, in the engrave file'],
    ['Machine', null],
    ['Machine', 'Workshop CO2 (CO2 laser)'],
    ['Speed', '5 mm/s'],
    ['Power', '10–14.5 %'],
    ['Passes', '1'],
    ['Recipe notes', notes],
    ['File', null],
    ['Line density', '360 lines per inch'],
    ['Halftone', 'Jarvis–Judice–Ninke'],
    ['Tone', 'Negative (the laser marks light)'],
    ['Pixels', '2700 × 3420'],
    ['Prep version', '3'],
    ['Estimated burn', 'about 1 h 12 min at 5 mm/s'],
  ],
  checks: ['The blank is the right material and size', 'A test burn on scrap of the same material looks right', 'Packed with order 48'],
  paper,
});

describe('the job sheet', () => {
  // Checked with Debian's Poppler: pdfinfo's page count, pdftotext's text.
  it.each(['LETTER', 'A4'] as const)('fits one %s page, however long the recipe notes, ending them with "…"', async (paper) => {
    const long = 'Clean the glass with alcohol first; run one pass at the lower power and check. '.repeat(20);
    const pdf = await jobSheetPdf(sheet(long, paper));
    expect(pdfPages(pdf)).toBe(1);
    const text = pdfText(pdf).replace(/\s+/g, ' ');
    expect(text).toContain('Before you burn');
    expect(text).toContain('Estimated burn');
    expect(text).toContain('…');
  });

  it('keeps short notes whole', async () => {
    const pdf = await jobSheetPdf(sheet('Check it with a test burn on scrap.', 'LETTER'));
    expect(pdfPages(pdf)).toBe(1);
    expect(pdfText(pdf).replace(/\s+/g, ' ')).toContain('Check it with a test burn on scrap.');
  });
});
