import pino from 'pino';

export function createLogger(level: string) {
  return pino({ level, redact: ['req.headers.cookie', 'req.headers.authorization', 'res.headers["set-cookie"]'] });
}
