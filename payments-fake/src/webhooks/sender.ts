export interface SendOutcome {
  ok: boolean;
  statusCode: number | null;
  error: string | null;
}

/** One signed POST; any 2xx is success, anything else (status, refusal, timeout) is a failed attempt. */
export async function sendOnce(
  url: string,
  payload: string,
  signature: string,
  timeoutMs: number,
  closing: AbortSignal,
): Promise<SendOutcome> {
  try {
    const response = await fetch(url, {
      method: 'POST',
      headers: {
        'Content-Type': 'application/json; charset=utf-8',
        'Stripe-Signature': signature,
        'User-Agent': 'payments-fake-webhooks/1.0',
      },
      body: payload,
      redirect: 'manual',
      signal: AbortSignal.any([closing, AbortSignal.timeout(timeoutMs)]),
    });
    // Read the body so the connection is released before the next attempt.
    await response.arrayBuffer().catch(() => undefined);
    const ok = response.status >= 200 && response.status < 300;
    return { ok, statusCode: response.status, error: ok ? null : `receiver answered ${response.status}` };
  } catch (error) {
    const cause = (error as { cause?: { code?: string } }).cause?.code;
    return { ok: false, statusCode: null, error: cause ?? (error as Error).name ?? 'network error' };
  }
}
