import { Injectable } from '@nestjs/common';
import { readFileSync } from 'node:fs';
import { checkPassword, PASSWORD_MESSAGES, type FieldError } from '@meritline/shared';
import { unprocessable } from '../common/validation.js';

// Same path from src/auth and dist/auth: the list is read from the source tree.
const LIST_URL = new URL('../../src/auth/common-passwords.txt', import.meta.url);

@Injectable()
export class PasswordPolicyService {
  private readonly common = new Set(
    readFileSync(LIST_URL, 'utf8')
      .split('\n')
      .map((line) => line.trim().toLowerCase())
      .filter((line) => line && !line.startsWith('#')),
  );

  problems(password: string, email: string | null, field = 'password'): FieldError[] {
    const problem = checkPassword(password, email);
    if (problem) return [{ field, code: problem.code, message: problem.message }];
    if (this.common.has(password.trim().toLowerCase())) return [{ field, code: 'common', message: PASSWORD_MESSAGES.common }];
    return [];
  }

  /** New passwords only: existing accounts keep signing in with what they have. */
  assertAllowed(password: string, email: string | null, field = 'password') {
    const errors = this.problems(password, email, field);
    if (errors.length) throw unprocessable(errors, 'The password does not meet the password rules.');
  }
}
