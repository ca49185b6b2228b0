import { RUBRIC_CRITERIA, type ReviewInput } from '@/lib/validations/practical';

// The learner's e-mail after a review (the text lives here until a shared template set exists).

const escape = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

export function reviewEmail(input: { learnerName: string; courseTitle: string; round: number; review: ReviewInput; reviewerName: string; url: string }) {
  const approved = input.review.decision === 'approved';
  const subject = approved ? `Your practical batch is approved — ${input.courseTitle}` : `Your practical batch needs changes — ${input.courseTitle}`;
  const lines = RUBRIC_CRITERIA.map((c) => {
    const r = input.review.rubric[c.id];
    return `- ${c.label}: ${r.verdict === 'met' ? 'met' : 'not met'}${r.comment ? ` (${r.comment})` : ''}`;
  });
  const opening = approved
    ? `${input.reviewerName} reviewed round ${input.round} of your practical batch at the Tasting table and approved it.`
    : `${input.reviewerName} reviewed round ${input.round} of your practical batch at the Tasting table and asks for changes before it can be approved.`;
  const text = [
    `Hello ${input.learnerName},`,
    '',
    opening,
    '',
    ...(input.review.comment ? [approved ? 'Comment:' : 'What to change:', input.review.comment, ''] : []),
    'The rubric:',
    ...lines,
    '',
    approved ? 'See the review on your practical page:' : 'See the review and submit a new round on your practical page:',
    input.url,
    '',
    'Brinewright checks arithmetic against published tables; keep following tested recipes and your local guidance.',
  ].join('\n');
  const html = `<p>Hello ${escape(input.learnerName)},</p>
<p>${escape(opening)}</p>
${input.review.comment ? `<p><strong>${approved ? 'Comment' : 'What to change'}:</strong> ${escape(input.review.comment)}</p>` : ''}
<ul>${RUBRIC_CRITERIA.map((c) => {
    const r = input.review.rubric[c.id];
    return `<li>${escape(c.label)}: ${r.verdict === 'met' ? 'met' : '<strong>not met</strong>'}${r.comment ? ` — ${escape(r.comment)}` : ''}</li>`;
  }).join('')}</ul>
<p><a href="${escape(input.url)}">${approved ? 'See the review' : 'See the review and submit a new round'}</a></p>
<p><small>Brinewright checks arithmetic against published tables; keep following tested recipes and your local guidance.</small></p>`;
  return { subject, text, html };
}
