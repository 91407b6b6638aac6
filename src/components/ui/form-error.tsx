/** A form's own error (what no single field took), above its buttons. */
export function FormError({ message, className = '' }: { message?: string | null; className?: string }) {
  return message ? (
    <p role="alert" className={`text-sm font-bold text-verdict-fail ${className}`}>
      {message}
    </p>
  ) : null;
}

/** What an action just did (saved, submitted…), said politely to assistive tech; nothing when empty. */
export function Notice({ message, boxed = false }: { message?: string | null; boxed?: boolean }) {
  return message ? (
    <p role="status" className={`text-sm font-bold text-verdict-pass ${boxed ? 'rounded-plate border border-verdict-pass/30 bg-white px-3 py-2' : ''}`}>
      {message}
    </p>
  ) : null;
}
