/**
 * The one message for a save refused as stale (409 `stale`: someone saved this after it was
 * opened): the server's words, that the user's edits are still in the form, and a way to load
 * the saved version instead.
 */
export function StaleBanner({
  message,
  onReload,
  reloadLabel = 'Load the saved version (discards your edits)',
  detail = 'Your edits are still in the form: copy what you need, or load the saved version.',
  testId,
}: {
  message: string;
  onReload: () => void;
  reloadLabel?: string;
  /** What is kept and what to do next, under the server's words. */
  detail?: string;
  testId?: string;
}) {
  return (
    <div role="alert" data-testid={testId} className="rounded-plate border border-verdict-fail/40 bg-white px-3 py-2 text-sm text-verdict-fail">
      <p className="font-bold">{message}</p>
      <p className="mt-1 text-ink-soft">{detail}</p>
      <button type="button" className="mt-2 font-bold text-sounding underline" onClick={onReload}>
        {reloadLabel}
      </button>
    </div>
  );
}
