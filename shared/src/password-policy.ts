/** One password rule for the server and the browser; the server also refuses common passwords. */
export const PASSWORD_MIN_LENGTH = 12;
export const PASSWORD_MAX_LENGTH = 200;

export interface PasswordProblem {
  code: 'required' | 'too-short' | 'too-long' | 'is-email' | 'common';
  message: string;
}

export const PASSWORD_MESSAGES = {
  required: 'Choose a password.',
  'too-short': `Use at least ${PASSWORD_MIN_LENGTH} characters.`,
  'too-long': `Use at most ${PASSWORD_MAX_LENGTH} characters.`,
  'is-email': 'Do not use your e-mail address or its name part as the password.',
  common: 'This password is too common; choose one that is harder to guess.',
} as const satisfies Record<PasswordProblem['code'], string>;

/** The first rule the password breaks, or null. `email` may be omitted when it is not known (yet). */
export function checkPassword(password: string, email?: string | null): PasswordProblem | null {
  const problem = (code: PasswordProblem['code']): PasswordProblem => ({ code, message: PASSWORD_MESSAGES[code] });
  if (!password) return problem('required');
  if (password.length < PASSWORD_MIN_LENGTH) return problem('too-short');
  if (password.length > PASSWORD_MAX_LENGTH) return problem('too-long');
  if (email) {
    const address = email.trim().toLowerCase();
    const localPart = address.split('@')[0];
    const candidate = password.trim().toLowerCase();
    if (candidate === address || (localPart && candidate === localPart)) return problem('is-email');
  }
  return null;
}

/** How long a signed-in session may stay without activity before the server refuses it; set by an administrator. */
export interface SessionSettingsDto {
  idleMinutes: number;
}
export const IDLE_MINUTES_MIN = 2;
export const IDLE_MINUTES_MAX = 720;
