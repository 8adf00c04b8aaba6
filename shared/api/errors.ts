/**
 * Every error code the API answers with, and its HTTP status. Both sides read this table: the
 * server to pick the status, the client to know what a refusal means. Later features add rows.
 */
export const ERROR_STATUS = {
  /** malformed or wrong-shaped input; `details` lists `{ path, message }` per field */
  validation_failed: 400,
  unauthenticated: 401,
  invalid_credentials: 401,
  forbidden: 403,
  password_change_required: 403,
  /** signed in with a password only, and a second factor is required: set it up first */
  second_factor_setup_required: 403,
  /** the administrator's one-time password is past its time: ask for another */
  one_time_password_expired: 401,
  csrf_invalid: 403,
  /** the person wrote (or leads, or co-investigates) the draft they try to approve */
  four_eyes: 403,
  not_found: 404,
  /** a duplicate of something that must be unique (an e-mail address, a number) */
  conflict: 409,
  /** the record changed since the editor read it; `details.current` holds it as it is now */
  version_conflict: 409,
  reviewer_is_lead: 409,
  invalid_transition: 409,
  /** destructive work on an item without a notice that allows it (ASTM E860) */
  notice_required: 409,
  /** the case or item is under a legal hold: no sectioning, transfer or disposal */
  legal_hold: 409,
  /** issue asked for a draft that is not approved, or changed since it was approved */
  not_approved: 409,
  payload_too_large: 413,
  unsupported_file_type: 415,
  /** an image with more pixels than the server decodes (a decompression bomb, or simply huge) */
  image_too_large: 422,
  /** an image that is truncated or corrupt */
  image_unreadable: 422,
  /** the tensile engine refused the record or its options; the message is the engine's */
  tensile_input: 422,
  /** a findings draft with an element, mark or attribute the editor does not make; `details.path` says where */
  invalid_document: 422,
  /** an Idempotency-Key already used by this person for a different request */
  idempotency_key_reused: 422,
  too_many_requests: 429,
  internal_error: 500,
  /** a stored record failed its hash check */
  integrity_error: 500,
  database_unavailable: 503,
} as const

export type ErrorCode = keyof typeof ERROR_STATUS

export interface FieldIssue {
  path: string
  message: string
}

/** The body of every refusal. */
export interface ErrorBody {
  error: { code: ErrorCode; message: string; details?: unknown }
}
