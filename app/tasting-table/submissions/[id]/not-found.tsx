import { ButtonLink } from '@/components/ui/button';

export default function SubmissionNotFound() {
  return (
    <div className="mx-auto max-w-xl space-y-4 py-12 text-center">
      <h1 className="text-3xl font-bold">No such submission</h1>
      <p className="text-ink-soft">This practical submission does not exist, or its id was mistyped.</p>
      <ButtonLink href="/tasting-table">Back to the Tasting table</ButtonLink>
    </div>
  );
}
