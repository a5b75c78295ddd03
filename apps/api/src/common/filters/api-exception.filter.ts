import { ArgumentsHost, Catch, ExceptionFilter, HttpException, HttpStatus, Logger } from '@nestjs/common';
import { STATUS_CODES } from 'node:http';
import type { Response } from 'express';
import type { ApiError } from '@cribra/contracts';
import { lockedWriteError } from '../../locks/locked-write-error';

/**
 * Shapes every error as `{statusCode, error, message, details?}`. Unknown errors become a 500
 * with a neutral message (the stack goes to the log, never to the client).
 */
@Catch()
export class ApiExceptionFilter implements ExceptionFilter {
  private readonly logger = new Logger('Errors');

  catch(exception: unknown, host: ArgumentsHost): void {
    const res = host.switchToHttp().getResponse<Response>();
    const body = this.toBody(exception);
    if (body.statusCode >= 500) {
      this.logger.error(exception instanceof Error ? (exception.stack ?? exception.message) : String(exception));
    }
    if (res.headersSent) return;
    res.status(body.statusCode).json(body);
  }

  private toBody(exception: unknown): ApiError {
    if (exception instanceof HttpException) {
      const statusCode = exception.getStatus();
      const raw = exception.getResponse();
      const error = STATUS_CODES[statusCode] ?? 'Error';
      if (typeof raw === 'string') return { statusCode, error, message: raw };
      const r = raw as { message?: unknown; error?: unknown; details?: unknown };
      const message = Array.isArray(r.message) ? r.message.join('; ') : typeof r.message === 'string' ? r.message : error;
      const out: ApiError = { statusCode, error: typeof r.error === 'string' && r.error !== message ? r.error : error, message };
      if (r.details !== undefined) out.details = r.details;
      return out;
    }
    // Errors thrown by body-parser (malformed JSON, too large) carry an HTTP status of their own.
    const e = exception as { status?: number; statusCode?: number; type?: string; expose?: boolean; message?: string };
    const status = e?.status ?? e?.statusCode;
    if (typeof status === 'number' && status >= 400 && status < 500 && e.expose) {
      const message = e.type === 'entity.parse.failed' ? 'The request body is not valid JSON' : (e.message ?? 'Bad request');
      return { statusCode: status, error: STATUS_CODES[status] ?? 'Error', message };
    }
    const locked = lockedWriteError(exception);
    if (locked) return locked;
    return { statusCode: HttpStatus.INTERNAL_SERVER_ERROR, error: 'Internal Server Error', message: 'Something went wrong on the server' };
  }
}
