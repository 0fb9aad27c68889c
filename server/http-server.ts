import type { Server } from 'node:http';

/**
 * Timeouts of the HTTP server (Node's defaults are generous): headers must arrive within 20 s (a client
 * trickling headers holds no socket for long), a whole request within 10 minutes (a large photo on a slow
 * line still fits), and an idle kept-alive connection closes after 5 s. A stalled body is answered 408
 * sooner by the body-timeout middleware.
 */
export function applyServerTimeouts(server: Server): void {
  server.headersTimeout = 20_000;
  server.requestTimeout = 10 * 60_000;
  server.keepAliveTimeout = 5_000;
}
