export function Loading({ what = 'Loading' }: { what?: string }) {
  return (
    <p role="status" className="flex items-center gap-2 py-8 text-ink-soft">
      <span
        aria-hidden
        className="size-4 animate-spin rounded-full border-2 border-copper border-t-transparent"
      />
      {what}…
    </p>
  );
}
