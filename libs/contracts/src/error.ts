/** The one error shape every API route returns. */
export interface ApiError {
  statusCode: number;
  error: string;
  message: string;
  details?: unknown;
}

/** `details` of a 400 validation error: one entry per offending field (dotted path for nested ones). */
export interface FieldProblem {
  field: string;
  messages: string[];
}
