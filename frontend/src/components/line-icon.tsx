import type { ReactNode } from 'react';

/** A 24-unit line drawing in the text colour, hidden from screen readers: the button around it carries the words. */
export function LineIcon({ size = '1em', children }: { size?: string; children: ReactNode }) {
  return (
    <svg
      viewBox="0 0 24 24"
      width={size}
      height={size}
      fill="none"
      stroke="currentColor"
      strokeWidth="2"
      strokeLinecap="round"
      strokeLinejoin="round"
      aria-hidden="true"
      focusable="false"
    >
      {children}
    </svg>
  );
}
