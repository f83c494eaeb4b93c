export interface FieldError {
  field: string;
  code: string;
  message: string;
}

/** Body of every 4xx answer; `errors` is present on 422 (and 400 for malformed input). */
export interface ApiErrorBody {
  statusCode: number;
  message: string;
  errors?: FieldError[];
}

/** A person named on a record. */
export interface UserRef {
  id: string;
  name: string;
}
