/** The one error body every route returns. */
export class ErrorResponseDto {
  /** Machine-readable code, e.g. VALIDATION_FAILED, INVALID_CREDENTIALS, NOT_FOUND, STALE_VERSION */
  code: string;
  /** A sentence for people */
  message: string;
  /** Per-field messages for validation errors, keyed by field path */
  fields?: Record<string, string>;
}
