import { describe, expect, it } from 'vitest';
import { firmFormat } from '../../shared/formatting/firm-format';
import { forStandardFonts, renderPdf } from '../../server/documents/pdf';
import { pdfText } from '../support/pdf';

/*
 * pdfkit's built-in fonts draw WinAnsi only; Intl writes thin and narrow no-break spaces (U+2009, U+202F) in ranges,
 * times and grouping, and some month names carry letters outside WinAnsi. Read back with MuPDF, an independent
 * renderer. Expected strings by hand: French groups thousands with a space and writes the euro after the amount,
 * Polish abbreviates October "paź" (CLDR, from memory).
 */
describe('text on paper in any firm locale', () => {
  it('keeps only what the standard fonts can draw, with look-alikes for Intl spaces and minus signs', () => {
    expect(forStandardFonts('7\u2009–\u200911 Dec')).toBe('7 – 11 Dec');
    expect(forStandardFonts('8:30\u202fAM')).toBe('8:30\u00a0AM');
    expect(forStandardFonts('\u2212340.5 · 4.2 µm · 20 °C · €')).toBe('-340.5 · 4.2 µm · 20 °C · €');
    expect(forStandardFonts('7 paź 2026 · Łódź')).toBe('7 paz 2026 · Lódz');
    expect(forStandardFonts('12 → 24 months')).toBe('12 -> 24 months');
  });

  it('prints US, French and Polish dates, times and money that read back as written', async () => {
    const us = firmFormat({ locale: 'en-US', timeZone: 'America/Chicago', currency: 'USD' });
    const fr = firmFormat({ locale: 'fr-FR', timeZone: 'Europe/Paris', currency: 'EUR' });
    const pl = firmFormat({ locale: 'pl-PL', timeZone: 'Europe/Warsaw', currency: 'PLN' });
    const pdf = await renderPdf({ size: 'A4' }, (doc) => {
      doc.font('Helvetica').text(`Handed over ${us.dateTime('2026-12-07T14:30:00Z')}; days ${us.dateRange('2026-12-07', '2026-12-11')}`);
      doc.text(`Total ${fr.money(123_456)}`);
      doc.text(`Due ${pl.date('2026-10-07')}`);
    });
    const text = pdfText(pdf);
    // 14:30 UTC is 8:30 AM in Chicago in December (CST, UTC−6).
    expect(text).toContain('Handed over Dec 7, 2026, 8:30 AM CST; days Dec 7 – 11, 2026');
    expect(text).toContain('Total 1 234,56 €');
    expect(text).toContain('Due 7 paz 2026');
  });
});
