import { randomUUID } from 'node:crypto';
import type { ErrorRequestHandler, RequestHandler } from 'express';
import { HttpError } from './errors';

/** Unknown `/api` routes answer with a JSON 404, never the client page. */
export const apiNotFound: RequestHandler = (req, res) => {
  res.status(404).json({ error: { code: 'not_found', message: `No API route ${req.method} ${req.originalUrl}.` } });
};

interface BodyParserError {
  type?: string;
  status?: number;
  expose?: boolean;
}

/**
 * The last middleware. Known errors keep their status and message; body-parser failures become 400/413;
 * anything else is a generic 500 whose details stay in the server log under a request id.
 */
export const errorHandler: ErrorRequestHandler = (error: unknown, req, res, _next) => {
  if (error instanceof HttpError) {
    res.status(error.status).json({
      error: { code: error.code, message: error.message, fields: error.fields, ...error.details },
    });
    return;
  }
  const parserError = error as BodyParserError;
  if (parserError?.type === 'entity.parse.failed') {
    res.status(400).json({ error: { code: 'malformed_json', message: 'The request body is not valid JSON.' } });
    return;
  }
  if (parserError?.type === 'entity.too.large') {
    res.status(413).json({ error: { code: 'payload_too_large', message: 'The request body is too large.' } });
    return;
  }
  if (parserError?.status === 404) {
    // A missing file of the built client (serve-static), e.g. a chunk of an older build.
    res.status(404).json({ error: { code: 'not_found', message: `No file ${req.originalUrl}.` } });
    return;
  }
  if (parserError?.expose && parserError.status && parserError.status < 500) {
    res.status(parserError.status).json({ error: { code: 'bad_request', message: 'The request could not be read.' } });
    return;
  }
  const requestId = randomUUID();
  console.error(`[${requestId}] ${req.method} ${req.originalUrl}`, error);
  res.status(500).json({ error: { code: 'internal_error', message: `Something went wrong on the server (request ${requestId}).` } });
};
