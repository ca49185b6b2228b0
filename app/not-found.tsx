import { ButtonLink } from '@/components/ui/button';

export default function NotFound() {
  return (
    <div className="mx-auto max-w-xl space-y-4 py-12 text-center">
      <h1 className="text-3xl font-bold">Nothing on this shelf</h1>
      <p className="text-ink-soft">The page you asked for does not exist, or it has moved.</p>
      <ButtonLink href="/">Back to the start</ButtonLink>
    </div>
  );
}
