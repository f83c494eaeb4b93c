export interface StudyFieldError {
  field: string;
  code: string;
  message: string;
}

export class StudyValidationError extends Error {
  readonly errors: StudyFieldError[];

  constructor(errors: StudyFieldError[]) {
    super(errors.map((e) => `${e.field}: ${e.message}`).join('; '));
    this.name = 'StudyValidationError';
    this.errors = errors;
  }

  static single(field: string, code: string, message: string): StudyValidationError {
    return new StudyValidationError([{ field, code, message }]);
  }
}
