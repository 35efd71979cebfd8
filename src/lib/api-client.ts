import { AppError, errorBodySchema } from '#shared/errors.ts';
import type { z } from 'zod';

type RequestOptions<S extends z.ZodType> = {
  method?: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  body?: unknown;
  /** Parses the answer, so a server that drifts from the shared contract fails loudly here. */
  schema?: S;
  signal?: AbortSignal;
};

/**
 * The client's one way to call the API. A failed call always throws an AppError carrying the
 * server's code, message and field issues; the caller decides how to show it.
 */
export async function apiFetch<S extends z.ZodType>(path: string, options: RequestOptions<S> = {}): Promise<z.infer<S>> {
  let response: Response;
  try {
    response = await fetch(path, {
      method: options.method ?? 'GET',
      headers:
        options.body === undefined ? { accept: 'application/json' } : { accept: 'application/json', 'content-type': 'application/json' },
      body: options.body === undefined ? undefined : JSON.stringify(options.body),
      credentials: 'same-origin',
      signal: options.signal,
    });
  } catch (cause) {
    if ((cause as Error).name === 'AbortError') throw cause;
    throw new AppError('SERVICE_UNAVAILABLE', 'Cannot reach Etchwell. Check your connection and try again.', { cause });
  }
  const text = await response.text();
  const json: unknown = text ? safeJson(text) : undefined;
  if (!response.ok) {
    const body = errorBodySchema.safeParse(json);
    if (body.success) throw new AppError(body.data.code, body.data.message, { issues: body.data.issues });
    throw new AppError(
      response.status >= 500 ? 'INTERNAL' : 'BAD_REQUEST',
      `The server answered ${response.status} ${response.statusText}.`,
    );
  }
  return options.schema ? options.schema.parse(json) : (json as z.infer<S>);
}

function safeJson(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    return undefined;
  }
}
