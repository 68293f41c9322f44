export const MAIN_ID = 'main';

export function SkipLink() {
  return (
    <a
      href={`#${MAIN_ID}`}
      className="sr-only rounded-lg bg-ink px-4 py-3 font-semibold text-paper no-underline focus:not-sr-only focus:fixed focus:left-3 focus:top-3 focus:z-50"
    >
      Skip to main content
    </a>
  );
}
