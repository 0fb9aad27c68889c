import pino, { type Logger } from 'pino';

/**
 * The operator's log: one JSON line per event on stdout (pino). Every line has `event` (e.g. 'sign-in',
 * 'sign-in-failed', 'csrf-refused', 'role-refused', 'activity') and what the operator needs to follow it
 * (userId, productionId, ip); never a password, token or session id. LOG_LEVEL sets the level (default
 * 'info'; 'silent' under tests unless LOG_LEVEL is given).
 */
function level(): string {
  if (process.env.LOG_LEVEL) return process.env.LOG_LEVEL;
  return process.env.NODE_ENV === 'test' ? 'silent' : 'info';
}

export const log: Logger = pino({
  level: level(),
  base: { app: 'grisaille' },
  timestamp: pino.stdTimeFunctions.isoTime,
  redact: { paths: ['password', '*.password', 'token', '*.token', 'sid'], censor: '[hidden]' },
});

/** Lines written by `log` are also handed to these listeners (tests read the operator's events here). */
type Listener = (line: Record<string, unknown>) => void;
const listeners = new Set<Listener>();

/** Logs one operator event at `info` (or the given level) and tells the listeners. */
export function logEvent(event: string, fields: Record<string, unknown> = {}, lvl: 'info' | 'warn' = 'info'): void {
  const line = { event, ...fields };
  log[lvl](line);
  for (const l of listeners) l(line);
}

/** Subscribes to operator events; returns the unsubscribe function. */
export function onLogEvent(l: Listener): () => void {
  listeners.add(l);
  return () => listeners.delete(l);
}
