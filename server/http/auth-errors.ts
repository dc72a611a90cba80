import type { Auth } from '../auth.ts';

/**
 * better-auth answers errors as `{ code, message }`; the rest of the API uses
 * `{ error: { code, message } }`. This wraps its handler so every error has the one shape.
 */
export function withOurErrorShape(auth: Auth) {
  return async (request: Request): Promise<Response> => {
    const response = await auth.handler(request);
    if (response.status < 400) return response;
    const text = await response.text();
    let code = response.status === 429 ? 'too_many_attempts' : 'auth_error';
    let message = response.status === 429 ? 'Too many attempts. Wait a minute and try again.' : 'That did not work. Please try again.';
    try {
      const body = JSON.parse(text) as { code?: string; message?: string };
      if (body.code) code = body.code.toLowerCase();
      if (body.message && response.status !== 429) message = friendly(code, body.message);
    } catch {
      /* plain-text error: keep the generic message */
    }
    const headers = new Headers(response.headers);
    headers.set('content-type', 'application/json; charset=utf-8');
    headers.delete('content-length');
    return new Response(JSON.stringify({ error: { code, message } }), { status: response.status, headers });
  };
}

function friendly(code: string, fallback: string): string {
  switch (code) {
    case 'invalid_email_or_password':
      // one message for unknown e-mail and wrong password (OWASP ASVS 6.3.8)
      return 'That e-mail and password do not match an account.';
    case 'user_already_exists':
    case 'user_already_exists_use_another_email':
      return 'An account with this e-mail already exists. Sign in, or reset your password.';
    case 'invalid_token':
      return 'This reset link has expired or was already used. Ask for a new one.';
    default:
      return fallback;
  }
}
