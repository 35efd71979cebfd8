/** One line per request, as every fake logs: `[fake:name] METHOD path -> status (ms)`. */
export type RequestLogger = (line: string) => void;

export const consoleLogger =
  (name: string): RequestLogger =>
  (line) =>
    console.log(`[fake:${name}] ${line}`);

export const silentLogger: RequestLogger = () => {};

/** Express middleware writing one `logLine` per finished request. */
export function requestLogMiddleware(log: RequestLogger) {
  return (
    req: { method: string; originalUrl: string },
    res: { statusCode: number; on(event: 'finish', listener: () => void): unknown },
    next: () => void,
  ) => {
    const startedAt = Date.now();
    res.on('finish', () => log(logLine(req.method, req.originalUrl, res.statusCode, startedAt)));
    next();
  };
}

export function logLine(method: string, path: string, status: number, startedAt: number): string {
  // Signatures and keys in query strings are not for logs.
  const shown = path.replace(/(X-Amz-Signature|X-Amz-Credential|X-Amz-Security-Token)=[^&]*/gi, '$1=…');
  return `${method} ${shown} -> ${status} (${Date.now() - startedAt} ms)`;
}
