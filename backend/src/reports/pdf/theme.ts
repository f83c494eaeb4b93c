/** Colours follow the web app's palette (frontend/src/theme.ts): spruce for structure, slate for text and rules. */
export const colors = {
  spruce: '#1c4f4b',
  spruceMid: '#2f7a72',
  spruceLight: '#aed4ce',
  spruceWash: '#eef6f5',
  text: '#181e26',
  muted: '#4f5b6b',
  faint: '#94a0ae',
  rule: '#dde2e8',
  ruleStrong: '#94a0ae',
  panel: '#f6f8fa',
  pass: '#22635d',
  fail: '#a3361a',
  warning: '#b5650a',
  watermark: '#a3361a',
} as const;

export const A4 = { width: 595.28, height: 841.89 } as const;

export const margins = { top: 64, bottom: 60, left: 56, right: 56 } as const;

export const sizes = {
  body: 9.5,
  small: 8,
  tiny: 7,
  table: 8.5,
  heading1: 16,
  heading2: 12,
  heading3: 10,
} as const;
