/** A form's own error (what no single field took), above its buttons. */
export function FormError({ message, className = '' }: { message?: string | null; className?: string }) {
  return message ? (
    <p role="alert" className={`text-sm font-bold text-verdict-fail ${className}`}>
      {message}
    </p>
  ) : null;
}
