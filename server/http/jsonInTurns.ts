/**
 * JSON bodies for the routes that take large ones (a whole network: up to
 * IMPORT_BODY_LIMIT, 160 MB by default). `JSON.parse` of such a body holds
 * the event loop for seconds, so every other request waits; here a body
 * above SMALL_BODY_BYTES is parsed by a streaming parser (@streamparser/json)
 * fed in slices, with a turn of the event loop whenever the work has lasted
 * a turn's length (server/interchange/turns.ts). Smaller bodies keep
 * `JSON.parse`: a megabyte parses in a few milliseconds.
 *
 * The streaming parser is about half the speed of `JSON.parse` (measured on a
 * 34 MB body of feed records); the point is that nothing else waits for it.
 * Nesting is counted as the tokens arrive and refused past MAX_BODY_DEPTH, so
 * a body of opening brackets cannot grow the parser's stack without bound.
 *
 * The raw body is read by express.raw: the same size limit, counted on the
 * inflated bytes, and the same errors (413 too large, 400 malformed) as
 * express.json; a charset other than UTF-8 is refused with 415 as there.
 */
import express, { type RequestHandler } from 'express';
import { TokenParser, Tokenizer, TokenType } from '@streamparser/json';
import { Turns, nextTurn } from '../interchange/turns';
import { MAX_BODY_DEPTH } from './inputGuard';

export const SMALL_BODY_BYTES = 1 << 20;
/** bytes handed to the tokenizer at a time; a turn is checked between slices */
const SLICE_BYTES = 64 * 1024;

/** An error the error handler answers as body-parser's own (server/http/errors.ts). */
function bodyError(type: string, status: number, message: string): Error {
  return Object.assign(new Error(message), { type, status, expose: true });
}

const malformed = (why: string) => bodyError('entity.parse.failed', 400, `the body is not valid JSON: ${why}`);

/** Strict, as express.json is: the body is an object or an array. */
function firstByte(body: Buffer): number {
  for (let i = 0; i < body.length; i++) {
    const b = body[i];
    if (b !== 0x20 && b !== 0x09 && b !== 0x0a && b !== 0x0d) return b;
  }
  return -1;
}

/**
 * The parsed body; `pause` is awaited between slices (a turn of the event
 * loop in the server). Bodies up to `streamAbove` bytes go to JSON.parse.
 */
export async function parseJsonInTurns(body: Buffer, pause: () => Promise<void> = nextTurn, streamAbove = SMALL_BODY_BYTES): Promise<unknown> {
  const first = firstByte(body);
  if (first === -1) return {};
  if (first !== 0x7b && first !== 0x5b) throw malformed('it must be an object or an array');
  if (body.length <= streamAbove) {
    try {
      return JSON.parse(body.toString('utf8'));
    } catch (e) {
      throw malformed((e as Error).message);
    }
  }

  const tokenizer = new Tokenizer();
  const parser = new TokenParser({ paths: ['$'], keepStack: false });
  let value: unknown;
  let got = false;
  let depth = 0;
  parser.onValue = ({ value: v }) => {
    value = v;
    got = true;
  };
  tokenizer.onToken = (t) => {
    if (t.token === TokenType.LEFT_BRACE || t.token === TokenType.LEFT_BRACKET) {
      if (++depth > MAX_BODY_DEPTH) throw malformed(`it nests deeper than ${MAX_BODY_DEPTH} levels (byte ${t.offset})`);
    } else if (t.token === TokenType.RIGHT_BRACE || t.token === TokenType.RIGHT_BRACKET) depth--;
    parser.write(t);
  };
  tokenizer.onEnd = () => {
    if (!parser.isEnded) parser.end();
  };
  parser.onError = (e) => tokenizer.error(e);
  parser.onEnd = () => {
    if (!tokenizer.isEnded) tokenizer.end();
  };
  // The callbacks above throw into write(); the tokenizer's onError would otherwise swallow them.
  let failure: Error | undefined;
  tokenizer.onError = (e) => {
    failure ??= e;
  };

  // A slice is a few ms of work, so the clock is read after each one.
  const turns = new Turns(undefined, 1);
  for (let at = 0; at < body.length; at += SLICE_BYTES) {
    try {
      tokenizer.write(body.subarray(at, at + SLICE_BYTES));
    } catch (e) {
      failure ??= e as Error;
    }
    if (failure) break;
    if (turns.due()) {
      await pause();
      turns.restart();
    }
  }
  if (!failure && !tokenizer.isEnded) {
    try {
      tokenizer.end();
    } catch (e) {
      failure ??= e as Error;
    }
  }
  if (failure) throw (failure as { type?: string }).type === 'entity.parse.failed' ? failure : malformed(failure.message);
  if (!got) throw malformed('it ends before its value does');
  return value;
}

/** express.json's place for the large-body routes: the same limits and answers, parsed in turns. */
export function jsonInTurns(limit: string): RequestHandler {
  const raw = express.raw({ type: 'application/json', limit, inflate: true });
  return (req, res, next) => {
    raw(req, res, (err?: unknown) => {
      if (err) return next(err);
      if (!Buffer.isBuffer(req.body)) return next();
      const charset = /;\s*charset\s*=\s*"?([^";\s]+)/i.exec(req.headers['content-type'] ?? '')?.[1]?.toLowerCase();
      if (charset !== undefined && !charset.startsWith('utf-')) {
        return next(bodyError('charset.unsupported', 415, `unsupported charset "${charset.toUpperCase()}"`));
      }
      parseJsonInTurns(req.body).then(
        (value) => {
          req.body = value;
          next();
        },
        (e: unknown) => {
          req.body = undefined;
          next(e);
        },
      );
    });
  };
}
