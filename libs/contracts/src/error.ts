/** The one error shape every API route returns. */
export interface ApiError {
  statusCode: number;
  error: string;
  message: string;
  details?: unknown;
}
