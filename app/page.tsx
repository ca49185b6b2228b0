import Link from 'next/link';
import { ButtonLink } from '@/components/ui/button';
import { Card } from '@/components/ui/card';

const STEPS = [
  { title: 'Read and calculate', text: 'Lessons on acidity, salt, headspace and processing, each with a working calculator beside the idea it teaches.' },
  {
    title: 'Prove it',
    text: 'Quizzes marked as soon as you hand them in, a hands-on workshop with an instructor, and a practical batch you photograph at home.',
  },
  { title: 'Get certified', text: 'Your coordinator issues a certificate with a serial and a QR code that anyone can verify.' },
];

export default function HomePage() {
  return (
    <div className="space-y-12">
      <section className="grid items-center gap-8 md:grid-cols-[3fr_2fr]">
        <div className="space-y-5">
          <p className="text-sm font-semibold tracking-wide text-copper-700 uppercase">Home food-preservation training</p>
          <h1 className="text-4xl leading-tight font-bold md:text-5xl">Pickle and can with numbers you can check.</h1>
          <p className="max-w-prose text-lg text-ink-soft">
            Brinewright is where a food-preservation education program teaches home canners: lessons with calculators for acidity, brine, headspace and
            processing time by altitude; quizzes; workshops with an instructor; a practical batch reviewed from photos; and a certificate the coordinator issues
            and anyone can verify.
          </p>
          <div className="flex flex-wrap gap-3">
            <ButtonLink href="/courses">See the courses</ButtonLink>
            <ButtonLink href="/bench" variant="secondary">
              Open the Brine bench
            </ButtonLink>
          </div>
        </div>
        <Card className="bg-brine-50">
          <h2 className="mb-2 text-lg font-bold">Why the numbers matter</h2>
          <p className="text-ink-soft">
            Botulism spores survive boiling. Pickles are safe to process in boiling water only because the acid of a tested recipe keeps the food at pH 4.6 or
            below, and only when the jars are processed for the full tested time at your altitude. Brinewright checks the arithmetic; your tested recipe and
            local guidance decide the rest.
          </p>
        </Card>
      </section>
      <section aria-labelledby="how-it-works" className="space-y-4">
        <h2 id="how-it-works" className="text-2xl font-bold">
          How a course works
        </h2>
        <ol className="grid gap-4 md:grid-cols-3">
          {STEPS.map((step, index) => (
            <li key={step.title} className="rounded-jar border border-brine-100 bg-white p-5 shadow-shelf">
              <p className="font-display text-3xl text-copper-500" aria-hidden="true">
                {index + 1}
              </p>
              <h3 className="mt-1 text-lg font-bold">{step.title}</h3>
              <p className="mt-1 text-ink-soft">{step.text}</p>
            </li>
          ))}
        </ol>
      </section>
      <p className="text-ink-soft">
        Instructors review practicals at the <strong>Tasting table</strong>; coordinators run workshops and certificates from the{' '}
        <strong>Certificate desk</strong>. Already have a certificate? <Link href="/verify">Check its serial</Link>.
      </p>
    </div>
  );
}
