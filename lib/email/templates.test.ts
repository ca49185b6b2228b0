import { describe, expect, it } from 'vitest';
import { RUBRIC_CRITERIA, type ReviewInput } from '@/lib/validations/practical';
import {
  certificateIssuedEmail,
  certificateRevokedEmail,
  enrollmentReceiptEmail,
  practicalReviewedEmail,
  refundEmail,
  welcomeEmail,
  workshopReminderEmail,
} from './templates';

const workshop = { startsAt: '2026-12-12T16:00:00.000Z', endsAt: '2026-12-12T21:00:00.000Z', timeZone: 'America/Denver', place: 'Grange Hall, 14 Mill Road' };

const rubric = Object.fromEntries(
  RUBRIC_CRITERIA.map((c, i) => [c.id, i === 0 ? { verdict: 'not_met', comment: 'Headspace <1/4 in' } : { verdict: 'met', comment: '' }]),
) as ReviewInput['rubric'];
const review = (decision: ReviewInput['decision'], comment: string): ReviewInput => ({ decision, rubric, comment });

describe('e-mail templates', () => {
  it('every message has a text part and an HTML part with the same facts', () => {
    const all = [
      welcomeEmail({ to: 'a@test.example', name: 'Ana', confirmUrl: 'http://localhost:3000/confirm-email?token=abc' }),
      enrollmentReceiptEmail({
        to: 'a@test.example',
        name: 'Ana',
        courseTitle: 'Safe Pickling',
        workshop,
        amountCents: 4500,
        currency: 'usd',
        waived: false,
        appUrl: 'http://localhost:3000/',
      }),
      refundEmail({ to: 'a@test.example', name: 'Ana', courseTitle: 'Safe Pickling', workshop, amountCents: 4500, currency: 'usd' }),
      workshopReminderEmail({ to: 'a@test.example', name: 'Ana', courseTitle: 'Safe Pickling', workshop, appUrl: 'http://localhost:3000' }),
      practicalReviewedEmail({
        to: 'a@test.example',
        name: 'Ana',
        courseTitle: 'Safe Pickling',
        round: 1,
        review: review('changes_requested', 'Use new lids.'),
        reviewerName: 'Ines',
        url: 'http://localhost:3000/learn/safe-pickling/practical',
      }),
      certificateIssuedEmail({
        to: 'a@test.example',
        name: 'Ana',
        courseTitle: 'Safe Pickling',
        serial: 'BW-2026-0001',
        validUntil: new Date('2029-12-12T00:00:00Z'),
        verifyUrl: 'http://localhost:3000/verify/BW-2026-0001',
      }),
      certificateRevokedEmail({ to: 'a@test.example', name: 'Ana', courseTitle: 'Safe Pickling', serial: 'BW-2026-0001', reason: 'Issued in error.' }),
    ];
    expect(all.map((m) => m.kind)).toEqual([
      'user.welcome',
      'enrollment.receipt',
      'payment.refunded',
      'workshop.reminder',
      'practical.reviewed',
      'certificate.issued',
      'certificate.revoked',
    ]);
    for (const m of all) {
      expect(m.text).toContain('Hello Ana,');
      expect(m.html).toContain('Hello Ana,');
      expect(m.html).toMatch(/^<!doctype html>/);
      expect(m.text).toContain('never calls a recipe safe');
    }
  });

  it('the receipt names amount, workshop date and time in the place’s zone, and place', () => {
    const m = enrollmentReceiptEmail({
      to: 'a@test.example',
      name: 'Ana',
      courseTitle: 'Safe Pickling',
      workshop,
      amountCents: 4500,
      currency: 'usd',
      waived: false,
      appUrl: 'http://localhost:3000',
    });
    expect(m.text).toContain('Amount paid: $45.00');
    // 16:00 UTC is 9:00 MST (UTC−7) in Denver in December (IANA tz database).
    expect(m.text).toContain('Workshop: Saturday, December 12, 2026');
    expect(m.text).toContain('Time: 9:00 AM – 2:00 PM MST');
    expect(m.text).toContain('Place: Grange Hall, 14 Mill Road');
    expect(m.text).toContain('http://localhost:3000/pantry');
    expect(
      enrollmentReceiptEmail({
        to: 'a@test.example',
        name: 'Ana',
        courseTitle: 'X',
        workshop: null,
        amountCents: 0,
        currency: 'usd',
        waived: true,
        appUrl: 'http://x',
      }).text,
    ).toContain('$0.00 (course fee waived)');
  });

  it('escapes what people typed in the HTML part', () => {
    const m = practicalReviewedEmail({
      to: 'a@test.example',
      name: '<b>Ana</b>',
      courseTitle: 'X',
      round: 2,
      review: review('approved', '<script>alert(1)</script>'),
      reviewerName: 'Ines',
      url: 'http://x',
    });
    expect(m.html).not.toContain('<script>');
    expect(m.html).toContain('&lt;script&gt;');
    expect(m.html).toContain('&lt;b&gt;Ana&lt;/b&gt;');
    expect(m.html).toContain('Headspace &lt;1/4 in');
    const revoked = certificateRevokedEmail({ to: 'a@test.example', name: 'Ana', courseTitle: 'X', serial: 'S', reason: '<img src=x>' });
    expect(revoked.html).not.toContain('<img src=x>');
    expect(revoked.text).toContain('Reason given: <img src=x>');
  });

  it('the review e-mail names the batch in words, each rubric line and the page to open', () => {
    const m = practicalReviewedEmail({
      to: 'a@test.example',
      name: 'Ana',
      courseTitle: 'Safe Pickling',
      round: 2,
      review: review('changes_requested', 'Use new lids.'),
      reviewerName: 'Ines',
      url: 'http://x/learn/safe-pickling/practical',
    });
    expect(m.subject).toBe('Needs another batch: your practical batch for Safe Pickling');
    expect(m.text).toContain('Ines looked at your second batch at the Tasting table and asks you for another batch');
    expect(m.text).toContain('For the next batch: Use new lids.');
    expect(m.text).toContain(`${RUBRIC_CRITERIA[0].label}: not met (Headspace <1/4 in)`);
    expect(m.text).toContain(`${RUBRIC_CRITERIA[1].label}: met`);
    expect(m.text).toContain('http://x/learn/safe-pickling/practical');
  });

  it('attaches the certificate PDF when given', () => {
    const pdf = { filename: 'certificate.pdf', contentType: 'application/pdf', contentBase64: 'JVBERi0=' };
    expect(
      certificateIssuedEmail({ to: 'a@test.example', name: 'Ana', courseTitle: 'X', serial: 'S', validUntil: new Date(), verifyUrl: 'http://x', pdf })
        .attachments,
    ).toEqual([pdf]);
  });
});
