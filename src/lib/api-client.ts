import { apiErrorSchema } from '../../shared/api-error.ts';

/** Every failed API call throws one of these, whatever shape the server answered with. */
export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly fields: Record<string, string> | undefined;

  constructor(status: number, code: string, message: string, fields?: Record<string, string>) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.fields = fields;
  }
}

export function isApiError(error: unknown): error is ApiError {
  return error instanceof ApiError;
}

type RequestOptions = {
  method?: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  body?: unknown;
  signal?: AbortSignal;
  /**
   * A 401 normally means "your session ended": we send the user to sign-in. Calls that expect a
   * 401 as a normal answer (GET /api/me for a guest) pass `false`.
   */
  redirectOn401?: boolean;
};

// Our own wording for the auth library's codes (its own messages are terse and English-only).
const authCodeMessages: Record<string, string> = {
  INVALID_EMAIL_OR_PASSWORD: "That e-mail and password don't match an account. Check both and try again.",
  INVALID_TOKEN: 'This reset link has expired or was already used. Ask for a new one.',
  USER_ALREADY_EXISTS: 'An account with this e-mail already exists. Sign in instead, or reset your password.',
  USER_ALREADY_EXISTS_USE_ANOTHER_EMAIL: 'An account with this e-mail already exists. Sign in instead, or reset your password.',
  PASSWORD_TOO_SHORT: 'Use at least 8 characters.',
  PASSWORD_TOO_LONG: 'Use at most 128 characters.',
};
// Auth-library codes that belong to one form field rather than the whole form.
const authCodeFields: Record<string, string> = {
  USER_ALREADY_EXISTS: 'email',
  USER_ALREADY_EXISTS_USE_ANOTHER_EMAIL: 'email',
  PASSWORD_TOO_SHORT: 'password',
  PASSWORD_TOO_LONG: 'password',
};

const TOO_MANY_TRIES = 'Too many tries in a short time. Wait a minute, then try again.';
const statusMessages: Record<number, string> = {
  400: 'Some of what you entered needs another look.',
  401: 'Please sign in to continue.',
  403: "You don't have access to this.",
  404: "We couldn't find that.",
  409: 'That conflicts with something that already exists.',
  413: 'That is too large to send.',
  429: TOO_MANY_TRIES,
};

/**
 * Normalises both error shapes we receive: ours, `{ error: { code, message, fields? } }`, and the
 * auth library's, `{ code, message }` on /api/auth/*. Anything else gets a message by status.
 */
export function toApiError(status: number, body: unknown): ApiError {
  const ours = apiErrorSchema.safeParse(body);
  if (ours.success) {
    const { code, message, fields } = ours.data.error;
    return new ApiError(status, code, status === 429 ? TOO_MANY_TRIES : message, fields);
  }
  if (body && typeof body === 'object') {
    const b = body as { code?: unknown; message?: unknown };
    const code = typeof b.code === 'string' ? b.code : undefined;
    const message = typeof b.message === 'string' && b.message ? b.message : undefined;
    if (code || message) {
      const friendly = (code && authCodeMessages[code]) ?? (status === 429 ? TOO_MANY_TRIES : message) ?? statusMessages[status];
      const field = code ? authCodeFields[code] : undefined;
      return new ApiError(status, code ?? `http_${status}`, friendly ?? 'Something went wrong.', field ? { [field]: friendly ?? '' } : undefined);
    }
  }
  return new ApiError(
    status,
    status >= 500 ? 'server_error' : `http_${status}`,
    statusMessages[status] ?? (status >= 500 ? 'Something went wrong on our side. Please try again in a moment.' : 'Something went wrong.'),
  );
}

let unauthorizedHandler: () => void = () => {
  const next = window.location.pathname + window.location.search;
  window.location.assign(`/sign-in?next=${encodeURIComponent(next)}`);
};

/** The router installs a handler that navigates without a full reload (see src/app/router.tsx). */
export function setUnauthorizedHandler(handler: () => void): void {
  unauthorizedHandler = handler;
}

/** The only place in the client that calls fetch. */
export async function apiRequest<T>(path: string, options: RequestOptions = {}): Promise<T> {
  const { method = options.body === undefined ? 'GET' : 'POST', body, signal, redirectOn401 = true } = options;
  let response: Response;
  try {
    response = await fetch(path, {
      method,
      credentials: 'include',
      headers: { Accept: 'application/json', ...(body === undefined ? {} : { 'Content-Type': 'application/json' }) },
      body: body === undefined ? undefined : JSON.stringify(body),
      signal,
    });
  } catch (error) {
    if (error instanceof DOMException && error.name === 'AbortError') throw error;
    throw new ApiError(0, 'network_error', "We couldn't reach Namesake. Check your connection and try again.");
  }

  const text = await response.text();
  let data: unknown;
  if (text) {
    try {
      data = JSON.parse(text);
    } catch {
      data = undefined;
    }
  }

  if (!response.ok) {
    const error = toApiError(response.status, data);
    const isAuthCall = path.startsWith('/api/auth/');
    if (response.status === 401 && redirectOn401 && !isAuthCall) unauthorizedHandler();
    throw error;
  }
  return data as T;
}

export const api = {
  get: <T>(path: string, options: Omit<RequestOptions, 'method' | 'body'> = {}) => apiRequest<T>(path, { ...options, method: 'GET' }),
  post: <T>(path: string, body: unknown = {}, options: Omit<RequestOptions, 'method' | 'body'> = {}) => apiRequest<T>(path, { ...options, method: 'POST', body }),
  put: <T>(path: string, body: unknown, options: Omit<RequestOptions, 'method' | 'body'> = {}) => apiRequest<T>(path, { ...options, method: 'PUT', body }),
  patch: <T>(path: string, body: unknown, options: Omit<RequestOptions, 'method' | 'body'> = {}) => apiRequest<T>(path, { ...options, method: 'PATCH', body }),
  delete: <T>(path: string, options: Omit<RequestOptions, 'method' | 'body'> = {}) => apiRequest<T>(path, { ...options, method: 'DELETE' }),
};

/**
 * Multipart upload with progress. fetch() cannot report upload progress, so this one call uses
 * XMLHttpRequest; errors come back as the same ApiError as every other call.
 * `onProgress` gets a fraction 0–1 (or null when the size is unknown).
 */
export function upload<T>(path: string, formData: FormData, onProgress?: (fraction: number | null) => void, signal?: AbortSignal): Promise<T> {
  return new Promise<T>((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', path);
    xhr.withCredentials = true;
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.upload.onprogress = (e) => onProgress?.(e.lengthComputable ? e.loaded / e.total : null);
    xhr.onerror = () => reject(new ApiError(0, 'network_error', "We couldn't reach Namesake. Check your connection and try again."));
    xhr.onabort = () => reject(new DOMException('Upload cancelled', 'AbortError'));
    xhr.onload = () => {
      let data: unknown;
      try {
        data = xhr.responseText ? JSON.parse(xhr.responseText) : undefined;
      } catch {
        data = undefined;
      }
      if (xhr.status >= 200 && xhr.status < 300) {
        onProgress?.(1);
        resolve(data as T);
        return;
      }
      if (xhr.status === 401) unauthorizedHandler();
      reject(toApiError(xhr.status, data));
    };
    signal?.addEventListener('abort', () => xhr.abort(), { once: true });
    xhr.send(formData);
  });
}

/**
 * Raw bytes of a same-origin file (the personaliser's font files: the engine parses the very TTF
 * the server uses). Failures throw the same ApiError as JSON calls.
 */
export async function getBytes(path: string, signal?: AbortSignal): Promise<Uint8Array> {
  let response: Response;
  try {
    response = await fetch(path, { credentials: 'include', signal });
  } catch (error) {
    if (error instanceof DOMException && error.name === 'AbortError') throw error;
    throw new ApiError(0, 'network_error', "We couldn't reach Namesake. Check your connection and try again.");
  }
  if (!response.ok) throw toApiError(response.status, await response.json().catch(() => undefined));
  return new Uint8Array(await response.arrayBuffer());
}
