import type { IncomingMessage, ServerResponse } from 'node:http';
import pino, { type DestinationStream, type Logger } from 'pino';
import { pinoHttp } from 'pino-http';
import pinoPretty from 'pino-pretty';

/** `json`: one object a line, for a log collector. `pretty`: short readable lines for a person at a terminal. */
export type LogFormat = 'json' | 'pretty';

const REDACT = ['req.headers.cookie', 'req.headers.authorization', 'res.headers["set-cookie"]'];

/** `destination` is stdout unless given (a test collects the lines). */
export function createLogger(level: string, format: LogFormat = 'json', destination?: DestinationStream): Logger {
  if (format === 'json') return destination ? pino({ level, redact: REDACT }, destination) : pino({ level, redact: REDACT });
  const pretty = pinoPretty({
    destination: destination ?? 1,
    sync: true,
    colorize: destination ? false : Boolean(process.stdout.isTTY),
    translateTime: 'SYS:HH:MM:ss',
    ignore: 'pid,hostname,reqId',
    singleLine: true,
  });
  return pino({ level, redact: REDACT }, pretty);
}

const failed = (res: ServerResponse, err?: Error) => Boolean(err) || res.statusCode >= 500;
const requestLine = (req: IncomingMessage, res: ServerResponse, ms?: number) =>
  `${req.method} ${(req as IncomingMessage & { originalUrl?: string }).originalUrl ?? req.url} ${res.statusCode}${ms === undefined ? '' : ` ${ms} ms`}`;

/**
 * One log entry per request; a failed one (5xx) at error level. In JSON, at info with the request and response
 * objects, as a log collector wants them. Pretty, a short line at debug (LOG_LEVEL=debug shows them), so the
 * terminal keeps the start banner and shows warnings and errors; the error itself is logged where it is handled.
 */
export function requestLogger(logger: Logger, format: LogFormat) {
  const ignore = (req: IncomingMessage) => req.url === '/api/health';
  if (format === 'json') {
    return pinoHttp({ logger, autoLogging: { ignore }, customLogLevel: (_req, res, err) => (failed(res, err) ? 'error' : 'info') });
  }
  return pinoHttp({
    logger,
    autoLogging: { ignore },
    quietReqLogger: true,
    quietResLogger: true,
    customLogLevel: (_req, res, err) => (failed(res, err) ? 'error' : 'debug'),
    customSuccessObject: () => ({}),
    customErrorObject: () => ({}),
    customSuccessMessage: requestLine,
    // pino-http passes the response time here too, though its types leave it out.
    customErrorMessage: (req, res, _err, ms?: number) => requestLine(req, res, ms),
  });
}
