import { ButtonLink } from '@/components/ui/button';

export default function Forbidden() {
  return (
    <div className="mx-auto max-w-xl space-y-4 py-12 text-center">
      <p className="font-display text-5xl text-copper-500" aria-hidden="true">
        403
      </p>
      <h1 className="text-3xl font-bold">This page is for another role</h1>
      <p className="text-ink-soft">
        Your account is signed in, but it does not have access to this page. If you think it should, ask your program coordinator to check your role.
      </p>
      <ButtonLink href="/">Back to the start</ButtonLink>
    </div>
  );
}
