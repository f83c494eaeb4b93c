import type { SVGProps } from 'react';

const base: SVGProps<SVGSVGElement> = {
  viewBox: '0 0 24 24',
  width: '1em',
  height: '1em',
  fill: 'none',
  stroke: 'currentColor',
  strokeWidth: 2.2,
  strokeLinecap: 'round',
  strokeLinejoin: 'round',
  'aria-hidden': true,
  focusable: false,
};

export function MeetsIcon() {
  return (
    <svg {...base}>
      <circle cx="12" cy="12" r="9.5" />
      <path d="m7.5 12.5 3 3 6-7" />
    </svg>
  );
}

export function FailsIcon() {
  return (
    <svg {...base}>
      <path d="M12 2.8 22 20.5H2z" />
      <path d="M12 9.5v5M12 17.6v.1" />
    </svg>
  );
}

export function NotJudgedIcon() {
  return (
    <svg {...base}>
      <circle cx="12" cy="12" r="9.5" strokeDasharray="3 3" />
      <path d="M8 12h8" />
    </svg>
  );
}

export function NoteIcon() {
  return (
    <svg {...base}>
      <circle cx="12" cy="12" r="9.5" />
      <path d="M12 11v5.5M12 7.6v.1" />
    </svg>
  );
}
