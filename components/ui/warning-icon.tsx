/** A small warning triangle drawn as SVG, so it looks the same whatever fonts the reader has. */
export function WarningIcon({ className }: { className?: string }) {
  return (
    <svg
      aria-hidden="true"
      data-icon="warning"
      viewBox="0 0 16 16"
      width="1em"
      height="1em"
      className={className ?? 'mr-1 inline-block align-[-0.125em]'}
      fill="currentColor"
      focusable="false"
    >
      <path d="M8 1.2c.4 0 .8.2 1 .6l6.4 11.4c.4.8-.1 1.7-1 1.7H1.6c-.9 0-1.4-.9-1-1.7L7 1.8c.2-.4.6-.6 1-.6Zm-.9 4.3.2 4.6h1.4l.2-4.6H7.1Zm.9 5.6a.9.9 0 1 0 0 1.8.9.9 0 0 0 0-1.8Z" />
    </svg>
  );
}
