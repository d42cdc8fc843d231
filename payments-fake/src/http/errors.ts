/** The error shape Stripe returns: `{ error: { type, code?, message, param? } }` with a matching HTTP status. */
export type StripeErrorType = 'invalid_request_error' | 'idempotency_error' | 'api_error' | 'authentication_error';

export interface StripeErrorBody {
  error: { type: StripeErrorType; code?: string; message: string; param?: string; request_log_url?: string };
}

export class StripeApiError extends Error {
  constructor(
    readonly status: number,
    readonly type: StripeErrorType,
    message: string,
    readonly code?: string,
    readonly param?: string,
  ) {
    super(message);
  }

  toBody(): StripeErrorBody {
    const error: StripeErrorBody['error'] = { type: this.type, message: this.message };
    if (this.code) error.code = this.code;
    if (this.param) error.param = this.param;
    return { error };
  }
}

export function paramMissing(param: string): StripeApiError {
  return new StripeApiError(400, 'invalid_request_error', `Missing required param: ${param}.`, 'parameter_missing', param);
}

export function paramInvalid(param: string, rule: string): StripeApiError {
  return new StripeApiError(400, 'invalid_request_error', `Invalid ${param}: ${rule}`, 'parameter_invalid', param);
}

export function paramUnknown(param: string): StripeApiError {
  return new StripeApiError(
    400,
    'invalid_request_error',
    `Received unknown parameter: ${param}`,
    'parameter_unknown',
    param,
  );
}

export function paramUnsupported(param: string): StripeApiError {
  return new StripeApiError(
    400,
    'invalid_request_error',
    `Parameter ${param} exists in the Stripe API but this local stand-in does not support it.`,
    'parameter_unknown',
    param,
  );
}

/** Stripe's message for a missing object names its object type, e.g. "No such issuing.card: 'ic_x'". */
export function resourceMissing(objectName: string, id: string, param?: string): StripeApiError {
  const status = param ? 400 : 404;
  return new StripeApiError(status, 'invalid_request_error', `No such ${objectName}: '${id}'`, 'resource_missing', param);
}

export function internalError(): StripeApiError {
  return new StripeApiError(500, 'api_error', 'An unknown error occurred in the local payments stand-in.');
}
