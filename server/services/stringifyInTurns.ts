/**
 * `JSON.stringify` of a large answer (the network export: 132 MB at 100,000
 * sites) in slices, with a turn of the event loop whenever a turn's length
 * has passed (server/interchange/turns.ts), so other requests are answered
 * while it is made. The bytes are exactly those of `JSON.stringify(value)`: an object's own keys in
 * order, its array fields one element at a time (each element whole), and
 * what JSON leaves out left out (undefined and functions as fields; as array
 * elements they are null).
 */
import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type { Response } from 'express';
import { Turns, nextTurn } from '../interchange/turns';

/** text gathered before it is turned into bytes */
const CHUNK_CHARS = 1 << 20;

const plainArray = (v: unknown): v is unknown[] => Array.isArray(v) && typeof (v as { toJSON?: unknown }).toJSON !== 'function';
/** an object JSON writes key by key: no toJSON, no boxed primitive or other class */
const plainObject = (v: unknown): v is Record<string, unknown> => {
  if (v === null || typeof v !== 'object' || Array.isArray(v)) return false;
  const proto = Object.getPrototypeOf(v);
  return (proto === Object.prototype || proto === null) && typeof (v as { toJSON?: unknown }).toJSON !== 'function';
};

export async function stringifyInTurns(value: unknown, pause: () => Promise<void> = nextTurn): Promise<Buffer> {
  const chunks = await stringifyChunksInTurns(value, pause);
  return chunks.length === 1 ? chunks[0] : Buffer.concat(chunks);
}

/**
 * The same bytes as pieces of about a megabyte each. Joining them is a fresh
 * allocation of the whole (70 MB for the weak points at 100,000 sites: 0.6 s
 * of page faults on a loaded machine), so a sender writes them one by one.
 * Plain objects are written field by field at any depth (the diagram's
 * columns sit one level down); array elements are written whole.
 */
export async function stringifyChunksInTurns(value: unknown, pause: () => Promise<void> = nextTurn): Promise<Buffer[]> {
  if (!plainObject(value)) return [Buffer.from(JSON.stringify(value) ?? 'null')];
  const chunks: Buffer[] = [];
  let text = '';
  const add = (s: string) => {
    text += s;
    if (text.length >= CHUNK_CHARS) {
      chunks.push(Buffer.from(text));
      text = '';
    }
  };
  const turns = new Turns();
  const turn = async () => {
    await pause();
    turns.restart();
  };
  const writeObject = async (object: Record<string, unknown>) => {
    add('{');
    let firstField = true;
    for (const key of Object.keys(object)) {
      const v = object[key];
      if (plainObject(v) || plainArray(v)) {
        add(`${firstField ? '' : ','}${JSON.stringify(key)}:`);
        firstField = false;
        if (plainObject(v)) await writeObject(v);
        else {
          add('[');
          for (let i = 0; i < v.length; i++) {
            add(`${i === 0 ? '' : ','}${JSON.stringify(v[i]) ?? 'null'}`);
            if (turns.due()) await turn();
          }
          add(']');
        }
        continue;
      }
      const s = JSON.stringify(v);
      if (s === undefined) continue;
      add(`${firstField ? '' : ','}${JSON.stringify(key)}:${s}`);
      firstField = false;
      if (turns.due()) await turn();
    }
    add('}');
  };
  await writeObject(value);
  chunks.push(Buffer.from(text));
  return chunks;
}

/**
 * Sends `value` as JSON made in slices: the analysis answers list every
 * carriage or element, tens of megabytes at 100,000 sites, and `res.json`
 * would hold the event loop while it wrote them. `networkVersion`: the
 * answer is a function of the address and the network version alone, so the
 * ETag names the version instead of hashing 70 MB in one piece.
 */
export async function sendJsonInTurns(res: Response, value: unknown, networkVersion?: number): Promise<void> {
  const chunks = await stringifyChunksInTurns(value);
  if (networkVersion !== undefined) res.setHeader('ETag', `W/"network-${networkVersion}"`);
  res.type('json');
  if (chunks.length === 1) {
    // small answers: Express's send, with its ETag (when none is set) and 304 handling
    res.send(chunks[0]);
    return;
  }
  if (networkVersion !== undefined && res.req.fresh) {
    res.status(304).end();
    return;
  }
  res.setHeader('Content-Length', String(chunks.reduce((n, c) => n + c.length, 0)));
  if (res.req.method === 'HEAD') {
    res.end();
    return;
  }
  try {
    await pipeline(Readable.from(chunks, { objectMode: false }), res);
  } catch (e) {
    // the client went away mid-answer: nothing left to tell it
    if (!res.destroyed && !res.req.destroyed) throw e;
  }
}
