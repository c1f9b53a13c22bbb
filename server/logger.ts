import type { IncomingMessage, ServerResponse } from 'node:http';
import pino, { type DestinationStream, type Logger } from 'pino';
import { pinoHttp } from 'pino-http';
import pinoPretty from 'pino-pretty';
import { errSerializer, redactUrl, reqSerializer, resSerializer } from './log-redaction';

/** `json`: one object a line, for a log collector. `pretty`: short readable lines for a person at a terminal. */
export type LogFormat = 'json' | 'pretty';

const BASE = {
  redact: ['req.headers.cookie', 'req.headers.authorization', 'res.headers["set-cookie"]'],
  // Failed queries are logged without the values they ran with (server/log-redaction.ts).
  serializers: { err: errSerializer },
};

/** `destination` is stdout unless given (a test collects the lines). */
export function createLogger(level: string, format: LogFormat = 'json', destination?: DestinationStream): Logger {
  if (format === 'json') return destination ? pino({ level, ...BASE }, destination) : pino({ level, ...BASE });
  const pretty = pinoPretty({
    destination: destination ?? 1,
    sync: true,
    colorize: destination ? false : Boolean(process.stdout.isTTY),
    translateTime: 'SYS:HH:MM:ss',
    ignore: 'pid,hostname,reqId',
    singleLine: true,
  });
  return pino({ level, ...BASE }, pretty);
}

const failed = (res: ServerResponse, err?: Error) => Boolean(err) || res.statusCode >= 500;
const requestLine = (req: IncomingMessage, res: ServerResponse, ms?: number) =>
  `${req.method} ${redactUrl((req as IncomingMessage & { originalUrl?: string }).originalUrl ?? req.url ?? '')} ${res.statusCode}${ms === undefined ? '' : ` ${ms} ms`}`;

/**
 * One log entry per request; a failed one (5xx) at error level. In JSON, at info with the request and response
 * objects, as a log collector wants them. Pretty, a short line at debug (LOG_LEVEL=debug shows them), so the
 * terminal keeps the start banner and shows warnings and errors; the error itself is logged where it is handled.
 */
export function requestLogger(logger: Logger, format: LogFormat) {
  const ignore = (req: IncomingMessage) => req.url === '/api/health';
  const common = {
    logger,
    autoLogging: { ignore },
    // Unwrapped, so each serializer gets the raw object: a wrapped error serializer would see it already serialized.
    wrapSerializers: false,
    // Capability tokens are redacted from the URLs, Referer and Location (server/log-redaction.ts).
    serializers: {
      req: (req: IncomingMessage) => reqSerializer(pino.stdSerializers.req(req)),
      res: (res: ServerResponse) => resSerializer(pino.stdSerializers.res(res)),
      err: errSerializer,
    },
  };
  if (format === 'json') {
    return pinoHttp({ ...common, customLogLevel: (_req, res, err) => (failed(res, err) ? 'error' : 'info') });
  }
  return pinoHttp({
    ...common,
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
