/** A form's own error (the server refused or could not be reached), announced when it appears. */
export function FormAlert({ message }: { message?: string | null }) {
  if (!message) return null;
  return (
    <p role="alert" className="rounded-lg border border-beet-500 bg-beet-50 px-4 py-2 text-sm text-beet-700">
      {message}
    </p>
  );
}
