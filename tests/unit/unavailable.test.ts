import { DrizzleQueryError } from 'drizzle-orm/errors';
import pg from 'pg';
import { describe, expect, it } from 'vitest';
import { unavailableService } from '../../server/lib/unavailable';

const withCode = (code: string, message = 'x') => Object.assign(new Error(message), { code });
// pg's DatabaseError carries the SQLSTATE in `code`. Source: PostgreSQL manual, appendix A "PostgreSQL Error Codes".
const pgError = (code: string) => Object.assign(new pg.DatabaseError('from the server', 100, 'error'), { code });
// The AWS SDK adds $metadata to its errors; a network failure has no httpStatusCode.
const s3Error = (metadata: { httpStatusCode?: number }, extra: Record<string, unknown> = {}) => Object.assign(new Error('s3'), { $metadata: { attempts: 3, ...metadata }, ...extra });

describe('unavailableService', () => {
  it('counts PostgreSQL going away as the database being out', () => {
    expect(unavailableService(pgError('57P01'))).toBe('database'); // admin_shutdown
    expect(unavailableService(pgError('57P02'))).toBe('database'); // crash_shutdown
    expect(unavailableService(pgError('57P03'))).toBe('database'); // cannot_connect_now
    expect(unavailableService(pgError('08006'))).toBe('database'); // connection_failure
    expect(unavailableService(pgError('53300'))).toBe('database'); // too_many_connections
    expect(unavailableService(withCode('ECONNREFUSED'))).toBe('database');
    expect(unavailableService(new Error('Connection terminated unexpectedly'))).toBe('database');
    expect(unavailableService(new Error('timeout exceeded when trying to connect'))).toBe('database');
  });

  it('looks through the error Drizzle wraps around the driver’s, and through AggregateError', () => {
    expect(unavailableService(new DrizzleQueryError('select 1', [], pgError('57P01')))).toBe('database');
    expect(unavailableService(new AggregateError([new Error('other'), withCode('ECONNRESET')]))).toBe('database');
  });

  it('counts object storage answering 5xx or not answering as storage being out, but not a 4xx', () => {
    expect(unavailableService(s3Error({ httpStatusCode: 503 }))).toBe('storage');
    expect(unavailableService(s3Error({ httpStatusCode: 500 }))).toBe('storage');
    expect(unavailableService(s3Error({}, { code: 'ECONNREFUSED' }))).toBe('storage');
    expect(unavailableService(s3Error({}, { name: 'TimeoutError' }))).toBe('storage');
    expect(unavailableService(s3Error({ httpStatusCode: 404 }, { name: 'NoSuchKey' }))).toBeNull();
    expect(unavailableService(s3Error({ httpStatusCode: 403 }))).toBeNull();
  });

  it('leaves bugs and refusals by the database as they are', () => {
    expect(unavailableService(pgError('23505'))).toBeNull(); // unique_violation
    expect(unavailableService(pgError('42P01'))).toBeNull(); // undefined_table
    expect(unavailableService(new DrizzleQueryError('insert', [], pgError('23503')))).toBeNull();
    expect(unavailableService(new Error('simulated database failure'))).toBeNull();
    expect(unavailableService(new TypeError('x is undefined'))).toBeNull();
    expect(unavailableService(undefined)).toBeNull();
    expect(unavailableService('a string')).toBeNull();
  });

  it('stops on an error that is its own cause', () => {
    const loop: Error & { cause?: unknown } = new Error('loop');
    loop.cause = loop;
    expect(unavailableService(loop)).toBeNull();
  });
});
